import { FormArray, FormControl, FormGroup } from '@angular/forms';
import type { UnitSystem } from '../../../../../shared/engine';
import { forceGroup, massGroup, supportGroup, type ForceForm, type MassForm, type SupportForm } from './shaft-form';

/*
 * Typed form model of the calc editor. Numbers are held as the text the author typed (never null):
 * a blank or half-typed field is kept exactly, autosaved, and named by the engine's own message,
 * instead of turning into null or NaN on the way. form-values.ts converts to and from calc input.
 */
export type FeatureType = 'shoulder-fillet' | 'keyseat' | 'ring-groove' | 'cross-hole';
export type MaterialKindOption = 'steel' | 'stainless-steel' | 'aluminium' | 'cast-iron' | 'other';

const text = (value = '') => new FormControl(value, { nonNullable: true });

export interface MaterialForm {
  /** Library entry the values came from; '' when the author entered the material. Not part of the calc input. */
  libraryId: FormControl<string>;
  name: FormControl<string>;
  kind: FormControl<MaterialKindOption>;
  E: FormControl<string>;
  G: FormControl<string>;
  nu: FormControl<string>;
  Sy: FormControl<string>;
  Su: FormControl<string>;
  source: FormControl<string>;
  /** Shown with the masses (it matters for the critical speed), kept here because the format has it on the material. */
  density: FormControl<string>;
}

export interface SegmentForm {
  label: FormControl<string>;
  length: FormControl<string>;
  od: FormControl<string>;
  id: FormControl<string>;
  /** A per-segment material from an imported calc, kept verbatim as JSON ('' for none). */
  material: FormControl<string>;
}

export interface TorqueForm {
  label: FormControl<string>;
  at: FormControl<string>;
  mode: FormControl<'torque' | 'power'>;
  T: FormControl<string>;
  power: FormControl<string>;
  speed: FormControl<string>;
  Ta: FormControl<string>;
}

export interface FeatureForm {
  type: FormControl<FeatureType>;
  label: FormControl<string>;
  at: FormControl<string>;
  r: FormControl<string>;
  form: FormControl<'end-mill' | 'sled-runner'>;
  width: FormControl<string>;
  height: FormControl<string>;
  length: FormControl<string>;
  keySy: FormControl<string>;
  depth: FormControl<string>;
  diameter: FormControl<string>;
  Kt: FormControl<string>;
  Kts: FormControl<string>;
  source: FormControl<string>;
}

export interface BendingForm {
  label: FormControl<string>;
  at: FormControl<string>;
  Ma: FormControl<string>;
  Mm: FormControl<string>;
}

export interface FatigueForm {
  enabled: FormControl<boolean>;
  surface: FormControl<string>;
  surfaceTable: FormControl<string>;
  reliability: FormControl<string>;
  temperature: FormControl<string>;
  kd: FormControl<string>;
  kc: FormControl<string>;
  kf: FormControl<string>;
  kfOnMidrange: FormControl<boolean>;
  alternatingTorqueFraction: FormControl<string>;
  SePrime: FormControl<string>;
  SePrimeSource: FormControl<string>;
}

export interface EditorFormShape {
  units: FormControl<UnitSystem>;
  title: FormControl<string>;
  material: FormGroup<MaterialForm>;
  segments: FormArray<FormGroup<SegmentForm>>;
  torques: FormArray<FormGroup<TorqueForm>>;
  features: FormArray<FormGroup<FeatureForm>>;
  bending: FormArray<FormGroup<BendingForm>>;
  supports: FormArray<FormGroup<SupportForm>>;
  loads: FormArray<FormGroup<ForceForm>>;
  masses: FormArray<FormGroup<MassForm>>;
  speed: FormControl<string>;
  fatigue: FormGroup<FatigueForm>;
  notes: FormControl<string>;
}

export type EditorForm = FormGroup<EditorFormShape>;
export type EditorValue = ReturnType<EditorForm['getRawValue']>;
export type SegmentValue = EditorValue['segments'][number];
export type TorqueValue = EditorValue['torques'][number];
export type FeatureValue = EditorValue['features'][number];
export type BendingValue = EditorValue['bending'][number];

export function segmentGroup(v: Partial<SegmentValue> = {}): FormGroup<SegmentForm> {
  return new FormGroup({
    label: text(v.label),
    length: text(v.length),
    od: text(v.od),
    id: text(v.id ?? '0'),
    material: text(v.material),
  });
}

export function torqueGroup(v: Partial<TorqueValue> = {}): FormGroup<TorqueForm> {
  return new FormGroup({
    label: text(v.label),
    at: text(v.at),
    mode: new FormControl(v.mode ?? 'torque', { nonNullable: true }),
    T: text(v.T),
    power: text(v.power),
    speed: text(v.speed),
    Ta: text(v.Ta),
  });
}

export function featureGroup(v: Partial<FeatureValue> = {}): FormGroup<FeatureForm> {
  return new FormGroup({
    type: new FormControl<FeatureType>(v.type ?? 'shoulder-fillet', { nonNullable: true }),
    label: text(v.label),
    at: text(v.at),
    r: text(v.r),
    form: new FormControl(v.form ?? 'end-mill', { nonNullable: true }),
    width: text(v.width),
    height: text(v.height),
    length: text(v.length),
    keySy: text(v.keySy),
    depth: text(v.depth),
    diameter: text(v.diameter),
    Kt: text(v.Kt),
    Kts: text(v.Kts),
    source: text(v.source),
  });
}

export function bendingGroup(v: Partial<BendingValue> = {}): FormGroup<BendingForm> {
  return new FormGroup({ label: text(v.label), at: text(v.at), Ma: text(v.Ma), Mm: text(v.Mm) });
}

/** A fresh form holding `v`; the editor replaces the whole form on load, restore and unit change. */
export function editorForm(v: EditorValue): EditorForm {
  const m = v.material;
  const f = v.fatigue;
  return new FormGroup<EditorFormShape>({
    units: new FormControl<UnitSystem>(v.units, { nonNullable: true }),
    title: text(v.title),
    material: new FormGroup({
      libraryId: text(m.libraryId),
      name: text(m.name),
      kind: new FormControl(m.kind, { nonNullable: true }),
      E: text(m.E),
      G: text(m.G),
      nu: text(m.nu),
      Sy: text(m.Sy),
      Su: text(m.Su),
      source: text(m.source),
      density: text(m.density),
    }),
    segments: new FormArray(v.segments.map(segmentGroup)),
    torques: new FormArray(v.torques.map(torqueGroup)),
    features: new FormArray(v.features.map(featureGroup)),
    bending: new FormArray(v.bending.map(bendingGroup)),
    supports: new FormArray(v.supports.map(supportGroup)),
    loads: new FormArray(v.loads.map(forceGroup)),
    masses: new FormArray(v.masses.map(massGroup)),
    speed: text(v.speed),
    fatigue: new FormGroup({
      enabled: new FormControl(f.enabled, { nonNullable: true }),
      surface: text(f.surface),
      surfaceTable: text(f.surfaceTable),
      reliability: text(f.reliability),
      temperature: text(f.temperature),
      kd: text(f.kd),
      kc: text(f.kc),
      kf: text(f.kf),
      kfOnMidrange: new FormControl(f.kfOnMidrange, { nonNullable: true }),
      alternatingTorqueFraction: text(f.alternatingTorqueFraction),
      SePrime: text(f.SePrime),
      SePrimeSource: text(f.SePrimeSource),
    }),
    notes: text(v.notes),
  });
}

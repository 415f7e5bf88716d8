import { FormArray, FormControl, FormGroup } from '@angular/forms';
import type { UnitSystem } from '../../../../../shared/engine';
import { forceGroup, massGroup, supportGroup, type ForceForm, type MassForm, type SupportForm } from './shaft-form';
import {
  bendingGroup,
  featureGroup,
  segmentGroup,
  torqueGroup,
  type BendingForm,
  type FeatureForm,
  type SegmentForm,
  type TorqueForm,
} from './row-forms';
import { takeOverRowKeys } from './row-keys';

/*
 * Typed form model of the calc editor: the whole form with its material and fatigue groups (list rows are
 * in row-forms.ts and shaft-form.ts). Numbers are held as the text the author typed (never null):
 * a blank or half-typed field is kept exactly, autosaved, and named by the engine's own message,
 * instead of turning into null or NaN on the way. form-values.ts and form-to-input.ts convert from
 * and to calc input.
 */
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

const LISTS = ['segments', 'torques', 'features', 'bending', 'supports', 'loads', 'masses'] as const;

/**
 * A fresh form holding `v`; the editor replaces the whole form on load, restore and unit change. Given the form it
 * `replaces`, its list rows take over that form's row keys (row-keys.ts), so the screen keeps its rows.
 */
export function editorForm(v: EditorValue, replaces?: EditorForm): EditorForm {
  const m = v.material;
  const f = v.fatigue;
  const form = new FormGroup<EditorFormShape>({
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
  if (replaces) for (const list of LISTS) takeOverRowKeys(replaces.controls[list], form.controls[list]);
  return form;
}

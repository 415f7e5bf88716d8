import { FormControl, FormGroup } from '@angular/forms';

/*
 * Typed form rows of the calc editor's lists: shaft segments, torques, stress-raising features and entered
 * bending moments. As elsewhere in the editor, numbers are held as the typed text (editor-form.ts says why).
 */
export type FeatureType = 'shoulder-fillet' | 'keyseat' | 'ring-groove' | 'cross-hole';

const text = (value = '') => new FormControl(value, { nonNullable: true });

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

export type SegmentValue = ReturnType<FormGroup<SegmentForm>['getRawValue']>;
export type TorqueValue = ReturnType<FormGroup<TorqueForm>['getRawValue']>;
export type FeatureValue = ReturnType<FormGroup<FeatureForm>['getRawValue']>;
export type BendingValue = ReturnType<FormGroup<BendingForm>['getRawValue']>;

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

import { FormControl, FormGroup } from '@angular/forms';

/*
 * Typed form parts for the whole-shaft model (format v2): bearings, forces from gears, pulleys,
 * sprockets and couplings or entered directly, and attached masses. As elsewhere in the editor,
 * numbers are held as the typed text; shaft-values.ts converts to and from the calc input.
 */
export const BEARING_KINDS = [
  'deep-groove-ball',
  'cylindrical-roller',
  'tapered-roller',
  'spherical-roller',
  'self-aligning-ball',
  'plain',
] as const;
export type BearingKind = (typeof BEARING_KINDS)[number];

export const BEARING_NAMES: Record<BearingKind, string> = {
  'deep-groove-ball': 'Deep-groove ball',
  'cylindrical-roller': 'Cylindrical roller',
  'tapered-roller': 'Tapered roller',
  'spherical-roller': 'Spherical roller',
  'self-aligning-ball': 'Self-aligning ball',
  plain: 'Plain (journal)',
};

/** `point`: forces entered directly; the others derive their forces from the torque they pass on. */
export const FORCE_KINDS = ['point', 'gear', 'pulley', 'sprocket', 'coupling'] as const;
export type ForceKind = (typeof FORCE_KINDS)[number];

export const FORCE_NAMES: Record<ForceKind, string> = {
  point: 'Force',
  gear: 'Gear',
  pulley: 'Belt pulley',
  sprocket: 'Chain sprocket',
  coupling: 'Coupling',
};

const text = (value = '') => new FormControl(value, { nonNullable: true });

export interface SupportForm {
  label: FormControl<string>;
  at: FormControl<string>;
  kind: FormControl<BearingKind>;
  C: FormControl<string>;
  locating: FormControl<boolean>;
  /** Radial and axial load factors from the bearing maker, for P = X·Fr + Y·Fa when there is an axial load. */
  X: FormControl<string>;
  Y: FormControl<string>;
}

export interface ForceForm {
  kind: FormControl<ForceKind>;
  label: FormControl<string>;
  at: FormControl<string>;
  Fy: FormControl<string>;
  Fz: FormControl<string>;
  Fx: FormControl<string>;
  pitchDiameter: FormControl<string>;
  pressureAngle: FormControl<string>;
  helixAngle: FormControl<string>;
  diameter: FormControl<string>;
  pullFactor: FormControl<string>;
  direction: FormControl<string>;
  T: FormControl<string>;
}

export interface MassForm {
  label: FormControl<string>;
  at: FormControl<string>;
  mass: FormControl<string>;
}

export type SupportValue = ReturnType<FormGroup<SupportForm>['getRawValue']>;
export type ForceValue = ReturnType<FormGroup<ForceForm>['getRawValue']>;
export type MassValue = ReturnType<FormGroup<MassForm>['getRawValue']>;

export function supportGroup(v: Partial<SupportValue> = {}): FormGroup<SupportForm> {
  return new FormGroup({
    label: text(v.label),
    at: text(v.at),
    kind: new FormControl<BearingKind>(v.kind ?? 'deep-groove-ball', { nonNullable: true }),
    C: text(v.C),
    locating: new FormControl(v.locating ?? false, { nonNullable: true }),
    X: text(v.X),
    Y: text(v.Y),
  });
}

export function forceGroup(v: Partial<ForceValue> = {}): FormGroup<ForceForm> {
  return new FormGroup({
    kind: new FormControl<ForceKind>(v.kind ?? 'point', { nonNullable: true }),
    label: text(v.label),
    at: text(v.at),
    Fy: text(v.Fy),
    Fz: text(v.Fz),
    Fx: text(v.Fx),
    pitchDiameter: text(v.pitchDiameter),
    pressureAngle: text(v.pressureAngle),
    helixAngle: text(v.helixAngle),
    diameter: text(v.diameter),
    pullFactor: text(v.pullFactor),
    direction: text(v.direction),
    T: text(v.T),
  });
}

export function massGroup(v: Partial<MassValue> = {}): FormGroup<MassForm> {
  return new FormGroup({ label: text(v.label), at: text(v.at), mass: text(v.mass) });
}

/** The numeric fields each kind of force element sends to the engine (the rest stay in the form unused). */
export const FORCE_FIELDS: Record<ForceKind, (keyof ForceValue)[]> = {
  point: ['at', 'Fy', 'Fz', 'Fx'],
  gear: ['at', 'pitchDiameter', 'pressureAngle', 'helixAngle', 'direction', 'T'],
  pulley: ['at', 'diameter', 'pullFactor', 'direction', 'T'],
  sprocket: ['at', 'diameter', 'pullFactor', 'direction', 'T'],
  coupling: ['at', 'Fy', 'Fz', 'T'],
};

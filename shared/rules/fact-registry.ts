import { SUPPORT_KINDS, UNIT_LABELS } from '../engine';
import { LOAD, SLOPE_PARAMS, SUPPORT } from './beam-facts-registry';
import { bool, num, str, type FactQuantity, type FactSpec } from './fact-spec';
import type { Scope } from './rule-set-schema';

/*
 * The facts the evaluator provides, per clause scope. Rule sets may name nothing else (validation
 * refuses unknown facts). Values are in SI whatever the calc's unit system, so one rule set serves
 * SI and US calcs; the checklist converts actual and limit back to the calc's units for display.
 */
export type { FactType, FactQuantity, FactSpec } from './fact-spec';
export { PLAIN_QUANTITIES } from './fact-spec';

export const MATERIAL_KINDS = ['steel', 'stainless-steel', 'aluminium', 'cast-iron', 'other'] as const;
export const FEATURE_TYPES = ['shoulder-fillet', 'keyseat', 'ring-groove', 'cross-hole'] as const;
export const CRITERION_KEYS = ['goodman', 'asmeElliptic', 'gerber', 'soderberg'] as const;
/** Parameters of the old ASME transmission-shafting rule behind the allowableShear fact. */
export const ASME_PARAMS = ['asmeSyFraction', 'asmeSuFraction', 'asmeKeywayFactor'] as const;

const fatigueBy: FactSpec = {
  type: 'object',
  isNullable: true,
  quantity: '1',
  label: 'fatigue safety factor by each criterion',
  values: CRITERION_KEYS,
};

const SHAFT: Record<string, FactSpec> = {
  materialKind: str('calc material kind', MATERIAL_KINDS),
  unitSystem: str('unit system of the calc', ['SI', 'US']),
  segmentCount: num('1', 'number of segments'),
  featureCount: num('1', 'number of features'),
  hasFatigue: bool('fatigue data entered'),
  hasBending: bool('bending moments entered'),
  hasKeyseat: bool('shaft has a keyseat'),
  engineWarningCount: num('1', 'number of engine warnings'),
  length: num('length', 'shaft length'),
  twistTotal: num('angle', 'end-to-end angle of twist (magnitude)'),
  tauMax: num('stress', 'largest nominal shear stress τmax'),
  minYieldSafety: num('1', 'lowest yield safety factor', true),
  minFatigueSafety: num('1', 'lowest fatigue safety factor (rule-set criterion)', true),
  hasSupports: bool('bearings entered (beam model solved)'),
  maxDeflection: num('length', 'largest transverse deflection (resultant)', true),
  criticalSpeed: num('speed', 'first bending critical speed', true),
  operatingSpeed: num('speed', 'operating speed', true),
  criticalSpeedRatio: num('1', 'ratio of first critical speed to operating speed', true),
};

const SEGMENT: Record<string, FactSpec> = {
  index: num('1', 'segment index'),
  materialKind: str('material kind', MATERIAL_KINDS),
  od: num('length', 'outer diameter'),
  id: num('length', 'inner diameter'),
  length: num('length', 'segment length'),
  boreRatio: num('1', 'bore ratio di/do'),
  isHollow: bool('hollow segment'),
  hasKeyseat: bool('keyseat on the segment'),
  isLoaded: bool('segment carries load'),
  Sy: num('stress', 'yield strength Sy'),
  Su: num('stress', 'ultimate strength Su'),
  G: num('modulus', 'shear modulus G'),
  torque: num('torque', 'largest internal torque |T|'),
  tauMax: num('stress', 'nominal shear stress τmax'),
  allowableShear: { ...num('stress', 'allowable shear stress (old ASME rule)'), params: ASME_PARAMS },
  twist: num('angle', 'angle of twist of the segment (magnitude)'),
  twistPerLength: num('twistPerLength', 'twist per unit length'),
  twistPerDiameter: num('angle', 'twist over a length of one diameter'),
  sigmaVonMises: num('stress', 'von Mises stress σ′max'),
  yieldSafety: num('1', 'yield safety factor (von Mises)', true),
  yieldSafetyTresca: num('1', 'yield safety factor (Tresca)', true),
  Se: num('stress', 'endurance limit Se', true),
  fatigueSafety: num('1', 'fatigue safety factor (rule-set criterion)', true),
  fatigueSafetyBy: fatigueBy,
};

const FEATURE: Record<string, FactSpec> = {
  index: num('1', 'feature index'),
  segment: num('1', 'index of the governing segment'),
  type: str('feature type', FEATURE_TYPES),
  form: str('keyseat form', ['end-mill', 'sled-runner'], true),
  materialKind: str('material kind', MATERIAL_KINDS),
  isLoaded: bool('section carries load'),
  at: num('length', 'station'),
  d: num('length', 'section diameter d'),
  D: num('length', 'larger diameter D', true),
  r: num('length', 'notch radius r'),
  rOverD: num('1', 'notch radius ratio r/d'),
  DOverd: num('1', 'diameter ratio D/d', true),
  tOverR: num('1', 'step-to-radius ratio t/r', true),
  Kt: num('1', 'stress-concentration factor Kt'),
  Kts: num('1', 'stress-concentration factor Kts'),
  isKtEntered: bool('Kt entered by the author'),
  isKtsEntered: bool('Kts entered by the author'),
  q: num('1', 'notch sensitivity q'),
  qs: num('1', 'notch sensitivity qs'),
  Kf: num('1', 'fatigue stress-concentration factor Kf'),
  Kfs: num('1', 'fatigue stress-concentration factor Kfs'),
  Sy: num('stress', 'yield strength Sy'),
  Su: num('stress', 'ultimate strength Su'),
  sigmaVonMises: num('stress', 'peak von Mises stress σ′max'),
  yieldSafety: num('1', 'yield safety factor (von Mises)', true),
  Se: num('stress', 'endurance limit Se', true),
  fatigueSafety: num('1', 'fatigue safety factor (rule-set criterion)', true),
  fatigueSafetyBy: fatigueBy,
  hasKey: bool('key dimensions given'),
  keyShearStress: num('stress', 'key shear stress', true),
  keyBearingStress: num('stress', 'key bearing stress', true),
  keyShearSafety: num('1', 'key shear safety factor', true),
  keyBearingSafety: num('1', 'key bearing safety factor', true),
  M: num('torque', 'bending moment from the beam model'),
  isBendingFromModel: bool('bending moment computed from loads and bearings'),
};

export const FACTS: Readonly<Record<Scope, Readonly<Record<string, FactSpec>>>> = {
  shaft: SHAFT,
  segment: SEGMENT,
  feature: FEATURE,
  support: SUPPORT,
  load: LOAD,
};
export { SLOPE_PARAMS, SUPPORT_KINDS };

/** Unit label of a fact quantity in a unit system. */
export function quantityUnit(q: FactQuantity, system: 'SI' | 'US'): string {
  if (q === '1' || q === 'rad' || q === 'h') return q;
  return UNIT_LABELS[system][q];
}

/** SI unit label of a fact (the unit its value and any limit compared with it are in). */
export function factUnit(spec: FactSpec): string {
  if (spec.quantity === null) return '';
  return quantityUnit(spec.quantity, 'SI');
}

export function factSpec(scope: Scope, name: string): FactSpec | undefined {
  return Object.prototype.hasOwnProperty.call(FACTS[scope], name) ? FACTS[scope][name] : undefined;
}

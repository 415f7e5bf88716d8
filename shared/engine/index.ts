/*
 * Torquetrail calculation engine: plain TypeScript with no framework or Node imports, so the
 * server, the browser and the command line run the same code.
 */
export { ENGINE_VERSION, CAUTION } from './version';
export {
  calcInputSchema,
  type CalcInput,
  type MaterialInput,
  type SegmentInput,
  type TorqueInput,
  type FeatureInput,
  type BendingInput,
  type FatigueInput,
} from './schema';
export { validateCalcInput, CalcInputError, type ValidationResult } from './validate';
export type { CalcIssue } from './issue-messages';
export { evaluateShaft, evaluateValidInput } from './evaluate';
export { twistBetween } from './twist';
export { torqueFromPower } from './power';
export { toSI, fromSI, toBase, fromBase, UNIT_LABELS, type UnitSystem, type Quantity } from './units';
export type {
  CalcResult,
  SegmentResult,
  FeatureResult,
  TorquePiece,
  ResolvedTorque,
  Endurance,
  Extreme,
  FieldInfo,
  StressSet,
  KeyCheck,
  FeatureMethods,
  StaticStress,
} from './result';
export type { SafetyByCriterion } from './fatigue-criteria';
export type {
  BeamResults,
  SupportResult,
  LoadResult,
  MassResult,
  BendingPoint,
  DeflectionPoint,
  CriticalSpeed,
} from './beam/beam-result';
export { SUPPORT_KINDS, type SupportInput, type MassInput, type SupportKind } from './beam/beam-schema';
export type { LoadInput } from './beam/load-schema';
export { formatNumber } from './number-format';
export { formatResultTable } from './result-table';
export { calcInputJsonSchemaText } from './json-schema';
export { METHOD_NAMES, FIELD_NAMES, FILLET_KTS_NAMES } from './methods';
export { featureTag, placeOf, fieldLabel, namePathsIn } from './field-places';

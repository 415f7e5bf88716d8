import type { BeamResults } from './beam/beam-result';
import type { SafetyByCriterion } from './fatigue-criteria';
import type { CalcIssue } from './issue-messages';
import type { FeatureResult, SegmentResult } from './section-results';
import type { UnitSystem } from './units';

export type {
  Endurance,
  FeatureMethods,
  FeatureResult,
  KeyCheck,
  SegmentResult,
  StaticStress,
  StressSet,
} from './section-results';

/*
 * Output of evaluateShaft. Plain numbers at documented places, in the calc's unit system; `fields`
 * gives each numeric field name its unit and formula, and per-feature `method` names the source of
 * each factor. A safety factor is null where the point carries no load (it would be infinite).
 */
export interface FieldInfo {
  unit: string;
  formula: string;
}

export interface Extreme {
  value: number;
  at: number;
  where: 'segment' | 'feature';
  index: number;
}

export interface TorquePiece {
  start: number;
  end: number;
  segment: number;
  T: number;
  Ta: number;
  /** Accumulated twist at `start`, measured from the left end. */
  twistStart: number;
  /** Signed twist rate on the piece. */
  twistPerLength: number;
}

export interface ResolvedTorque {
  index: number;
  at: number;
  T: number;
  Ta: number;
  isFromPower: boolean;
}

export interface CalcResult extends BeamResults {
  engineVersion: string;
  units: UnitSystem;
  caution: string;
  fields: Readonly<Record<string, FieldInfo>>;
  methods: Readonly<Record<string, string>>;
  length: number;
  segments: SegmentResult[];
  features: FeatureResult[];
  torques: ResolvedTorque[];
  torqueDiagram: TorquePiece[];
  twistTotal: number;
  maxShear: { value: number; at: number; segment: number };
  minYieldSafety: Extreme | null;
  minFatigueSafety: Record<keyof SafetyByCriterion, Extreme | null> | null;
  warnings: CalcIssue[];
}

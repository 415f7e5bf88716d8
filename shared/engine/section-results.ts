import type { SafetyByCriterion } from './fatigue-criteria';

/*
 * Per-section output of evaluateShaft: each segment and each feature (fillet, keyseat, groove, hole), with
 * the static and fatigue figures at it. Units and formulas of every field: fields.ts.
 */
export interface Endurance {
  SePrime: number;
  ka: number;
  kb: number;
  kc: number;
  kd: number;
  ke: number;
  kf: number;
  Se: number;
}

export interface StaticStress {
  /** Largest von Mises stress on the segment or at the feature (σ′max, Shigley Eq. 7-15). */
  sigmaVonMises: number;
  tauTresca: number;
  yieldSafety: number | null;
  yieldSafetyTresca: number | null;
}

export interface SegmentResult extends StaticStress {
  index: number;
  label: string | undefined;
  start: number;
  end: number;
  length: number;
  od: number;
  id: number;
  isHollow: boolean;
  material: string;
  G: number;
  Sy: number;
  Su: number;
  J: number;
  Zp: number;
  /** Internal torque of largest magnitude on the segment (sign per the torque-diagram convention). */
  T: number;
  tauMax: number;
  /** Start of the stretch where tauMax acts. */
  tauMaxAt: number;
  tauInner: number;
  gamma: number;
  /** Signed angle of twist of the segment, Σ T·L/(G·J) over its pieces. */
  twist: number;
  /** Largest twist rate on the segment, |T|max/(G·J). */
  twistPerLength: number;
  hasKeyseat: boolean;
  /** Station of the largest von Mises stress and the bending moments there (nominal section, no Kf). */
  governingAt: number;
  Ma: number;
  Mm: number;
  endurance: Endurance | null;
  fatigueSafety: SafetyByCriterion | null;
  /** Station where each criterion's safety factor is lowest. */
  fatigueAt: Record<keyof SafetyByCriterion, number> | null;
}

export interface StressSet {
  sigmaA: number;
  sigmaM: number;
  tauA: number;
  tauM: number;
}

export interface KeyCheck {
  shearStress: number | null;
  bearingStress: number | null;
  shearSafety: number | null;
  bearingSafety: number | null;
  method: string;
}

export interface FeatureMethods {
  Kt: string;
  Kts: string;
  notch: string;
}

export interface FeatureResult extends StaticStress {
  index: number;
  type: string;
  label: string | undefined;
  at: number;
  segment: number;
  /** Diameters used: D larger and d smaller at a shoulder; d the section diameter elsewhere. */
  D: number | null;
  d: number;
  di: number;
  /** Notch radius used for q (capped at 4 mm for the Neuber constant). */
  r: number;
  rOverD: number | null;
  DOverd: number | null;
  tOverR: number | null;
  Kt: number;
  Kts: number;
  q: number;
  qs: number;
  Kf: number;
  Kfs: number;
  method: FeatureMethods;
  /** Resultant bending moment at the station from the beam model (0 without supports). */
  M: number;
  /** Ma = M (rotating shaft) + author-entered Ma; Mm = author-entered Mm. */
  Ma: number;
  Mm: number;
  Ta: number;
  Tm: number;
  nominal: StressSet;
  peak: StressSet;
  endurance: Endurance | null;
  fatigueSafety: SafetyByCriterion | null;
  key: KeyCheck | null;
}

import type { SafetyByCriterion } from './fatigue-criteria';
import type { CalcResult, Extreme, FeatureResult, SegmentResult } from './result';
import { CRITERIA } from './trackers';

type Summary = Pick<CalcResult, 'twistTotal' | 'maxShear' | 'minYieldSafety' | 'minFatigueSafety'>;

function lower(cur: Extreme | null, value: number | null, at: number, where: Extreme['where'], index: number): Extreme | null {
  return value !== null && (cur === null || value < cur.value) ? { value, at, where, index } : cur;
}

function minFatigue(segments: SegmentResult[], features: FeatureResult[]): Summary['minFatigueSafety'] {
  if (!segments.some((s) => s.fatigueSafety)) return null;
  const out: Record<keyof SafetyByCriterion, Extreme | null> = { goodman: null, asmeElliptic: null, gerber: null, soderberg: null };
  for (const c of CRITERIA) {
    for (const s of segments) out[c] = lower(out[c], s.fatigueSafety?.[c] ?? null, s.fatigueAt?.[c] ?? s.start, 'segment', s.index);
    for (const f of features) out[c] = lower(out[c], f.fatigueSafety?.[c] ?? null, f.at, 'feature', f.index);
  }
  return out;
}

/** Whole-shaft figures: end-to-end twist, the largest nominal shear and the lowest safety factors. */
export function summarize(segments: SegmentResult[], features: FeatureResult[]): Summary {
  let twistTotal = 0;
  let maxShear = { value: 0, at: 0, segment: 0 };
  let minYield: Extreme | null = null;
  for (const s of segments) {
    twistTotal += s.twist;
    if (s.tauMax > maxShear.value) maxShear = { value: s.tauMax, at: s.tauMaxAt, segment: s.index };
    minYield = lower(minYield, s.yieldSafety, s.governingAt, 'segment', s.index);
  }
  for (const f of features) minYield = lower(minYield, f.yieldSafety, f.at, 'feature', f.index);
  return { twistTotal, maxShear, minYieldSafety: minYield, minFatigueSafety: minFatigue(segments, features) };
}

import type { CalcResult, Extreme, FeatureResult, SegmentResult } from './result';
import type { Criterion } from './trackers';

type Summary = Pick<CalcResult, 'twistTotal' | 'maxShear' | 'minYieldSafety' | 'minFatigueSafety'>;

function lower(
  cur: Extreme | null,
  value: number | null,
  at: number,
  where: Extreme['where'],
  index: number,
): Extreme | null {
  return value !== null && (cur === null || value < cur.value) ? { value, at, where, index } : cur;
}

// One Extreme per criterion, built only once the lowest point is known (this runs on every keystroke).
function lowestFor(c: Criterion, segments: SegmentResult[], features: FeatureResult[]): Extreme | null {
  let best: number | null = null;
  let where: Extreme['where'] = 'segment';
  let index = 0;
  for (const s of segments) {
    const v = s.fatigueSafety ? s.fatigueSafety[c] : null;
    if (v !== null && (best === null || v < best)) [best, where, index] = [v, 'segment', s.index];
  }
  for (const f of features) {
    const v = f.fatigueSafety ? f.fatigueSafety[c] : null;
    if (v !== null && (best === null || v < best)) [best, where, index] = [v, 'feature', f.index];
  }
  if (best === null) return null;
  const at = where === 'feature' ? features[index].at : (segments[index].fatigueAt?.[c] ?? segments[index].start);
  return { value: best, at, where, index };
}

function minFatigue(segments: SegmentResult[], features: FeatureResult[]): Summary['minFatigueSafety'] {
  if (!segments.length || !segments[0].fatigueSafety) return null;
  return {
    goodman: lowestFor('goodman', segments, features),
    asmeElliptic: lowestFor('asmeElliptic', segments, features),
    gerber: lowestFor('gerber', segments, features),
    soderberg: lowestFor('soderberg', segments, features),
  };
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

import { UNIT_LABELS, type CalcInput } from '../engine';
import type { RuleSet } from './rule-set-schema';
import { trial, type GoverningRow, type Trial } from './diameter-trial';

export type { GoverningRow } from './diameter-trial';

export interface MinimumDiameterOptions {
  /** Search range as factors of the segment's present outer diameter; default 0.25 and 4. */
  lo?: number;
  hi?: number;
  /** Bisection stops when the bracket is narrower than this fraction of the diameter; default 1e-4. */
  tolerance?: number;
  /** Points of the first scan, spaced geometrically over the range; default 48. */
  scanPoints?: number;
}

export interface MinimumDiameter {
  segment: number;
  label: string;
  unit: string;
  current: number;
  status: 'found' | 'lower-end-passes' | 'none-in-range';
  /** Smallest passing outer diameter found (hollow: `inner` keeps the bore ratio); null if none. */
  minimum: number | null;
  inner: number | null;
  range: [number, number];
  tolerance: number;
  /** At the minimum: the mandatory row closest to its limit. Otherwise: the row failing at the top of the range. */
  governing: GoverningRow | null;
  message: string;
  evaluations: number;
}

function scanGrid(lo: number, hi: number, n: number): number[] {
  return Array.from({ length: n }, (_, k) => lo * (hi / lo) ** (k / (n - 1)));
}

/** Bisection between a failing and a passing diameter; returns the passing end and its trial. */
function bisect(run: (od: number) => Trial, fail: number, pass: number, at: Trial, tolerance: number): [number, Trial] {
  let best = at;
  while (pass - fail > tolerance * pass) {
    const mid = (fail + pass) / 2;
    const t = run(mid);
    if (t.passes) [pass, best] = [mid, t];
    else fail = mid;
  }
  return [pass, best];
}

function searchSegment(
  input: CalcInput,
  ruleSet: RuleSet,
  index: number,
  o: Required<MinimumDiameterOptions>,
): MinimumDiameter {
  const seg = input.segments[index];
  const range: [number, number] = [o.lo * seg.od, o.hi * seg.od];
  let evaluations = 0;
  const run = (od: number): Trial => {
    evaluations++;
    return trial(input, ruleSet, index, od);
  };
  const grid = scanGrid(range[0], range[1], o.scanPoints);
  // Scan first: utilisation need not fall monotonically with diameter (factors change with D/d).
  let k = 0;
  let at = run(grid[0]);
  while (!at.passes && k < grid.length - 1) at = run(grid[++k]);
  const unit = UNIT_LABELS[input.units].length;
  const base = {
    segment: index,
    label: seg.label ?? `segment ${index + 1}`,
    unit,
    current: seg.od,
    range,
    tolerance: o.tolerance,
  };
  if (!at.passes) return { ...base, ...noneInRange(range, unit, at, evaluations) };
  if (k === 0) return { ...base, ...lowerEndPasses(grid[0], seg, at, evaluations) };
  const [minimum, best] = bisect(run, grid[k - 1], grid[k], at, o.tolerance);
  return { ...base, ...found(minimum, seg, best, o.tolerance, evaluations) };
}

// Keys in the order the result has always listed them.
type Outcome = Pick<MinimumDiameter, 'status' | 'minimum' | 'inner' | 'governing' | 'evaluations' | 'message'>;
type Segment = CalcInput['segments'][number];

function noneInRange(range: [number, number], unit: string, at: Trial, evaluations: number): Outcome {
  const [lo, hi] = range.map((d) => d.toPrecision(4));
  return {
    status: 'none-in-range',
    minimum: null,
    inner: null,
    governing: at.governing,
    evaluations,
    message: `no diameter within [${lo}, ${hi}] ${unit} passes every mandatory clause`,
  };
}

function lowerEndPasses(lowest: number, seg: Segment, at: Trial, evaluations: number): Outcome {
  return {
    status: 'lower-end-passes',
    minimum: lowest,
    inner: (seg.id / seg.od) * lowest,
    governing: at.governing,
    evaluations,
    message: 'the lower end of the search range already passes; the minimum may be smaller',
  };
}

function found(minimum: number, seg: Segment, best: Trial, tolerance: number, evaluations: number): Outcome {
  const clause = best.governing?.reference ?? 'no clause';
  return {
    status: 'found',
    minimum,
    inner: (seg.id / seg.od) * minimum,
    governing: best.governing,
    evaluations,
    message: `smallest passing outer diameter, within ${tolerance * 100} %; governed by ${clause}`,
  };
}

/**
 * For each segment, the smallest outer diameter (hollow: same bore ratio) that passes every
 * mandatory clause the segment influences, the other segments held fixed: a geometric scan of
 * [lo, hi] × the present diameter, then bisection between the first passing point and the failing
 * point below it. A passing band narrower than the scan spacing can be missed; the scan spacing is
 * (hi/lo)^(1/(scanPoints−1)). `input` must be valid (validateCalcInput).
 */
export function minimumDiameters(
  input: CalcInput,
  ruleSet: RuleSet,
  options: MinimumDiameterOptions = {},
): MinimumDiameter[] {
  const o: Required<MinimumDiameterOptions> = { lo: 0.25, hi: 4, tolerance: 1e-4, scanPoints: 48, ...options };
  if (!(o.lo > 0 && o.hi > o.lo && o.tolerance > 0 && o.scanPoints >= 2)) {
    throw new RangeError('minimumDiameters: need 0 < lo < hi, tolerance > 0 and scanPoints ≥ 2');
  }
  return input.segments.map((_, i) => searchSegment(input, ruleSet, i, o));
}

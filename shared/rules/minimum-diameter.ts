import { evaluateValidInput, UNIT_LABELS, validateCalcInput, type CalcInput } from '../engine';
import { evaluateChecklistSync } from './checklist';
import type { ChecklistRow } from './checklist-types';
import { applyRuleSetMethods } from './rule-set-methods';
import type { RuleSet } from './rule-set-schema';

export interface MinimumDiameterOptions {
  /** Search range as factors of the segment's present outer diameter; default 0.25 and 4. */
  lo?: number;
  hi?: number;
  /** Bisection stops when the bracket is narrower than this fraction of the diameter; default 1e-4. */
  tolerance?: number;
  /** Points of the first scan, spaced geometrically over the range; default 48. */
  scanPoints?: number;
}

export interface GoverningRow {
  clauseId: string;
  reference: string;
  clauseTitle: string;
  location: string;
  status: ChecklistRow['status'];
  utilisation: number | null;
  message: string;
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

interface Trial {
  passes: boolean;
  governing: GoverningRow | null;
}

function governingOf(rows: ChecklistRow[]): GoverningRow | null {
  const bad = rows.filter((r) => r.status === 'fail' || r.status === 'error');
  const pool = bad.length ? bad : rows.filter((r) => r.status === 'pass');
  const top = pool.reduce<ChecklistRow | null>(
    (best, r) => (best === null || (r.utilisation ?? 0) > (best.utilisation ?? 0) ? r : best),
    null,
  );
  return (
    top && {
      clauseId: top.clauseId,
      reference: top.reference,
      clauseTitle: top.clauseTitle,
      location: top.location.label,
      status: top.status,
      utilisation: top.utilisation,
      message: top.message,
    }
  );
}

/*
 * One trial diameter: the segment resized (the bore scaled with it), validated, evaluated with the
 * rule set's methods and checked synchronously. Only mandatory rows that the segment can influence
 * count: the shaft's, its own and those of features on it or at its ends. Invalid geometry (a fillet
 * larger than the step, a groove through the wall) fails the trial with the reason.
 */
function trial(input: CalcInput, ruleSet: RuleSet, index: number, od: number): Trial {
  const seg = input.segments[index];
  const segments = input.segments.map((s, i) => (i === index ? { ...s, od, id: (seg.id / seg.od) * od } : s));
  const checked = validateCalcInput({ ...input, segments });
  if (!checked.ok) {
    const { path, message } = checked.issues[0];
    return {
      passes: false,
      governing: {
        clauseId: '',
        reference: '',
        clauseTitle: 'calc input invalid at this diameter',
        location: path,
        status: 'error',
        utilisation: null,
        message,
      },
    };
  }
  const effective = applyRuleSetMethods(checked.value, ruleSet);
  const result = evaluateValidInput(effective);
  const [start, end] = [result.segments[index].start, result.segments[index].end];
  const influenced = (r: ChecklistRow): boolean =>
    r.location.scope === 'shaft' ||
    (r.location.scope === 'segment' && r.location.index === index) ||
    (r.location.scope === 'feature' && r.location.at !== null && r.location.at >= start && r.location.at <= end);
  const rows = evaluateChecklistSync(effective, result, ruleSet).rows.filter(
    (r) => r.severity === 'mandatory' && influenced(r),
  );
  return {
    passes: rows.every((r) => r.status === 'pass' || r.status === 'not-applicable'),
    governing: governingOf(rows),
  };
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
  if (!at.passes) {
    return {
      ...base,
      status: 'none-in-range',
      minimum: null,
      inner: null,
      governing: at.governing,
      evaluations,
      message: `no diameter within [${range[0].toPrecision(4)}, ${range[1].toPrecision(4)}] ${unit} passes every mandatory clause`,
    };
  }
  if (k === 0) {
    return {
      ...base,
      status: 'lower-end-passes',
      minimum: grid[0],
      inner: (seg.id / seg.od) * grid[0],
      governing: at.governing,
      evaluations,
      message: 'the lower end of the search range already passes; the minimum may be smaller',
    };
  }
  const [minimum, best] = bisect(run, grid[k - 1], grid[k], at, o.tolerance);
  return {
    ...base,
    status: 'found',
    minimum,
    inner: (seg.id / seg.od) * minimum,
    governing: best.governing,
    evaluations,
    message: `smallest passing outer diameter, within ${o.tolerance * 100} %; governed by ${best.governing?.reference ?? 'no clause'}`,
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

import { formatNumber } from '../../../../../shared/engine/number-format';
import { fromBase, toBase } from '../../../../../shared/engine/units';
import type { CalcResult } from '../../../../../shared/engine';
import { shaftLimits, type LimitLine, type StationLimit } from '../../../../../shared/plots';
import type { Checklist, ChecklistRow, RuleSet } from '../../../../../shared/rules';

export interface PlotLimits {
  shear: LimitLine[];
  twist: LimitLine[];
  twistRate: LimitLine[];
  deflection: StationLimit[];
  slope: StationLimit[];
}

export const NO_LIMITS: PlotLimits = { shear: [], twist: [], twistRate: [], deflection: [], slope: [] };

type Span = { from: number; to: number; value: number };

/** Rows of clauses whose measure is `fact` in `scope`, with a numeric limit. */
function rowsMeasuring(checklist: Checklist, ruleSet: RuleSet, scope: string, fact: string): ChecklistRow[] {
  const ids = new Set(ruleSet.clauses.filter((c) => c.scope === scope && c.measure?.actual === fact).map((c) => c.id));
  return checklist.rows.filter((r) => ids.has(r.clauseId) && r.limit !== null && Number.isFinite(r.limit));
}

// Neighbouring segments with the same limit read as one line. The clause is named once, on its longest
// line; the other lines carry only their value, so a per-segment limit does not repeat words on every step.
function toLines(spans: Span[], unit: string, label: (s: Span) => string): LimitLine[] {
  const merged: Span[] = [];
  for (const s of [...spans].sort((a, b) => a.from - b.from)) {
    const last = merged[merged.length - 1];
    if (last && Math.abs(last.to - s.from) < 1e-9 && Math.abs(last.value - s.value) <= 1e-9 * Math.abs(s.value))
      last.to = s.to;
    else merged.push({ ...s });
  }
  const longest = merged.reduce((best, s, i) => (s.to - s.from > merged[best].to - merged[best].from ? i : best), 0);
  return merged.map((s, i) => ({
    value: s.value,
    from: s.from,
    to: s.to,
    label: i === longest ? label(s) : `${formatNumber(s.value, 3)} ${unit}`,
  }));
}

function segmentSpans(
  rows: ChecklistRow[],
  result: CalcResult,
  value: (row: ChecklistRow, seg: CalcResult['segments'][number]) => number,
): Span[] {
  return rows.flatMap((r) => {
    const seg = r.location.index === null ? undefined : result.segments[r.location.index];
    return seg ? [{ from: seg.start, to: seg.end, value: value(r, seg) }] : [];
  });
}

/**
 * The rule set's limits that can be drawn as lines on the diagrams: allowable shear per segment, a total
 * twist limit, and twist-per-length limits (a per-diameter limit is turned into a rate on each segment).
 */
export function plotLimits(checklist: Checklist | null, ruleSet: RuleSet | null, result: CalcResult): PlotLimits {
  if (!checklist || !ruleSet) return NO_LIMITS;
  const f = (v: number) => formatNumber(v, 3);
  const tauRows = rowsMeasuring(checklist, ruleSet, 'segment', 'tauMax');
  const stress = result.fields['tauMax']?.unit ?? '';
  const shear = toLines(
    segmentSpans(tauRows, result, (r) => r.limit!),
    stress,
    (s) => `§${tauRows[0].clauseId} allowable τ ${f(s.value)} ${stress}`,
  );
  const sign = result.twistTotal < 0 ? -1 : 1;
  const twist = rowsMeasuring(checklist, ruleSet, 'shaft', 'twistTotal').map((r) => ({
    value: sign * r.limit!,
    label: `§${r.clauseId} ${f(r.limit!)} ${r.unit}`,
  }));
  const rateRows = rowsMeasuring(checklist, ruleSet, 'segment', 'twistPerLength');
  const perDiaRows = rowsMeasuring(checklist, ruleSet, 'segment', 'twistPerDiameter');
  const u = result.units;
  const rateUnit = result.fields['twistPerLength']?.unit ?? '';
  // θ per diameter d becomes a rate θ/d in the calc's twist-rate unit (deg/m or deg/ft).
  const perDiaRate = (r: ChecklistRow, seg: CalcResult['segments'][number]) =>
    fromBase(toBase(r.limit!, 'angle', u) / toBase(seg.od, 'length', u), 'twistPerLength', u);
  const twistRate = [
    ...toLines(
      segmentSpans(rateRows, result, (r) => r.limit!),
      rateUnit,
      (s) => `§${rateRows[0].clauseId} ${f(s.value)} ${rateUnit}`,
    ),
    ...toLines(
      segmentSpans(perDiaRows, result, perDiaRate),
      rateUnit,
      () => `§${perDiaRows[0].clauseId} ${f(perDiaRows[0].limit!)}° per diameter`,
    ),
  ];
  return {
    shear,
    twist,
    twistRate,
    deflection: shaftLimits(checklist, ruleSet, result, 'deflection'),
    slope: shaftLimits(checklist, ruleSet, result, 'slope'),
  };
}

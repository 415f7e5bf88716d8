import { formatNumber } from '../engine/number-format';
import type { CalcResult } from '../engine';
import type { Checklist, RuleSet } from '../rules';
import type { StationLimit } from './shaft-diagrams';
import { beamUnit } from './beam-units';

// A slope limit may be written in mrad or degrees; the curve is in the engine's slope unit (rad).
const TO_RAD: Record<string, number> = { rad: 1, mrad: 1e-3, deg: Math.PI / 180, '°': Math.PI / 180 };

function inCurveUnit(value: number, from: string, to: string): number | null {
  if (from === to || from === '') return value;
  const a = TO_RAD[from];
  const b = TO_RAD[to];
  return a && b ? (value * a) / b : null;
}

/**
 * Limits of the standard's clauses that measure a deflection or a slope, placed at the station each
 * row judges (a gear, a bearing) or over the whole shaft; the clause is named on the first of them.
 * A limit in a unit the curve cannot be put in is left off the plot (it stays in the checklist).
 */
export function shaftLimits(
  checklist: Checklist | null,
  ruleSet: RuleSet | null,
  result: CalcResult,
  measure: 'deflection' | 'slope',
): StationLimit[] {
  if (!checklist || !ruleSet) return [];
  const pattern = measure === 'deflection' ? /deflection/i : /slope/i;
  const ids = new Set(ruleSet.clauses.filter((c) => c.measure && pattern.test(c.measure.actual)).map((c) => c.id));
  const curveUnit = beamUnit(result, measure);
  const named = new Set<string>();
  return checklist.rows.flatMap((r): StationLimit[] => {
    if (!ids.has(r.clauseId) || r.limit === null || !Number.isFinite(r.limit)) return [];
    const value = inCurveUnit(r.limit, r.unit, curveUnit);
    if (value === null) return [];
    const label = `${named.has(r.clauseId) ? '' : `§${r.clauseId} `}${formatNumber(r.limit, 3)} ${r.unit}`;
    named.add(r.clauseId);
    return [{ at: r.location.at, value, label }];
  });
}

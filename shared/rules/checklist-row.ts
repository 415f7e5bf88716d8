import type { UnitSystem } from '../engine';
import { errorText, type ClauseOutcome } from './clause-outcome';
import { fillMeasure } from './clause-measure';
import type { ChecklistRow } from './checklist-types';
import type { Facts } from './facts';
import type { Target } from './locations';
import type { PreparedClause } from './prepared-rule-set';
import { nonFiniteFact } from './clause-facts';

function steelWarning(p: PreparedClause, t: Target): string[] {
  const kind = t.facts.materialKind;
  if (p.clause.materialScope !== 'steel' || typeof kind !== 'string' || kind === 'steel') return [];
  return [
    `clause ${p.clause.id} was written for steel; this location is ${kind}: its limit may not be valid for this material`,
  ];
}

function nonFiniteFactError(p: PreparedClause, t: Target, params: Facts): string | null {
  const fact = nonFiniteFact(p.clause, t.facts, params);
  return fact === null
    ? null
    : `${fact} is not a finite number; the inputs are outside the range this check can evaluate`;
}

/** One checklist row from a clause's outcome at one location. Never throws. */
export function buildRow(
  p: PreparedClause,
  t: Target,
  outcome: ClauseOutcome,
  params: Facts,
  units: UnitSystem,
): ChecklistRow {
  const row: ChecklistRow = {
    clauseId: p.clause.id,
    clauseTitle: p.clause.title,
    reference: p.reference,
    severity: p.clause.severity,
    status: 'not-applicable',
    location: t.location,
    actual: null,
    limit: null,
    unit: '',
    utilisation: null,
    utilisationBasis: null,
    message: 'does not apply here',
    warnings: [],
  };
  // A non-finite fact compares false everywhere, so "not applicable" or "pass" would be a guess.
  const bad = outcome.error ?? nonFiniteFactError(p, t, params);
  if (bad !== null) {
    row.status = 'error';
    row.message = `could not be evaluated: ${bad}`;
    return row;
  }
  if (!outcome.applies) return row;
  const passes = outcome.passes === true;
  row.status = passes ? 'pass' : 'fail';
  row.warnings = steelWarning(p, t);
  row.message = `requirement ${passes ? 'met' : 'not met'}: ${p.clause.title}`;
  if (!p.measure) return row;
  try {
    fillMeasure(row, p.measure, t, params, units, passes);
  } catch (err) {
    Object.assign(row, {
      status: 'error',
      actual: null,
      limit: null,
      unit: '',
      utilisation: null,
      utilisationBasis: null,
      message: `could not be evaluated: ${errorText(err)}`,
    });
  }
  return row;
}

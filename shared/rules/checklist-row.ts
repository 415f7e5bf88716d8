import { formatNumber, fromSI, UNIT_LABELS, type UnitSystem } from '../engine';
import type { ClauseOutcome } from './clause-outcome';
import type { ChecklistRow, RowStatus } from './checklist-types';
import { factSpec, type FactQuantity } from './fact-registry';
import type { Facts } from './facts';
import type { Target } from './locations';
import type { Clause, RuleSet } from './rule-set-schema';

interface Measured {
  actual: number | null; limit: number | null; unit: string; label: string; quantity: FactQuantity;
}

const has = (o: object, k: string): boolean => Object.prototype.hasOwnProperty.call(o, k);

function lookup(name: string, facts: Facts, params: Facts): number | null {
  const v = has(facts, name) ? facts[name] : has(params, name) ? params[name] : undefined;
  if (v === undefined) throw new Error(`measure: Undefined fact: ${name}`);
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
}

/** Actual and limit of the clause's measure, converted from SI to the calc's units. */
function measured(ruleSet: RuleSet, clause: Clause, t: Target, params: Facts, units: UnitSystem): Measured | null {
  const m = clause.measure;
  if (!m) return null;
  const spec = factSpec(clause.scope, m.actual);
  const quantity = spec?.quantity ?? '1';
  const shown = (v: number | null): number | null => (v === null || units === 'SI' || quantity === '1' || quantity === 'angle' ? v : fromSI(v, quantity, units));
  const unit = quantity === '1' ? '1' : UNIT_LABELS[units][quantity];
  const label = (spec?.label ?? m.actual).replace('rule-set criterion', ruleSet.methods.fatigueCriterion);
  return { actual: shown(lookup(m.actual, t.facts, params)), limit: shown(lookup(m.limit, t.facts, params)), unit, label, quantity };
}

function utilisationOf(clause: Clause, v: Measured): number | null {
  if (v.actual === null || v.limit === null) return null;
  const u = clause.measure!.sense === 'at-most' ? (v.limit > 0 ? v.actual / v.limit : null) : (v.actual > 0 ? v.limit / v.actual : null);
  return u !== null && Number.isFinite(u) ? u : null;
}

const num = (v: number, unit: string): string => `${formatNumber(v, 4)}${unit === '1' ? '' : ` ${unit}`}`;

function measureText(clause: Clause, v: Measured, passes: boolean, u: number | null): string {
  if (v.actual === null || v.limit === null) {
    return `${v.label} is not available here (no load or no data); requirement ${passes ? 'met' : 'not met'}`;
  }
  const atMost = clause.measure!.sense === 'at-most';
  const verb = atMost ? (passes ? 'is within the limit of' : 'exceeds the limit of') : (passes ? 'meets the minimum of' : 'is below the minimum of');
  const util = u === null ? '' : ` (utilisation ${formatNumber(100 * u, 3)} %, ${atMost ? 'actual/limit' : 'limit/actual'})`;
  return `${v.label} ${num(v.actual, v.unit)} ${verb} ${num(v.limit, v.unit)}${util}`;
}

// A check that passes while its own measure is past the limit means the clause is inconsistent.
function contradicts(clause: Clause, v: Measured | null, passes: boolean): boolean {
  if (!passes || !v || v.actual === null || v.limit === null) return false;
  return clause.measure!.sense === 'at-most' ? v.actual > v.limit : v.actual < v.limit;
}

function warningsFor(clause: Clause, t: Target): string[] {
  const kind = t.facts.materialKind;
  if (clause.materialScope === 'steel' && typeof kind === 'string' && kind !== 'steel') {
    return [`clause ${clause.id} was written for steel; this location is ${kind}: its limit may not be valid for this material`];
  }
  return [];
}

/** One checklist row from a clause's outcome at one location. Never throws. */
export function buildRow(ruleSet: RuleSet, clause: Clause, t: Target, outcome: ClauseOutcome, params: Facts, units: UnitSystem): ChecklistRow {
  const row: ChecklistRow = {
    clauseId: clause.id, clauseTitle: clause.title, reference: `${ruleSet.code} v${ruleSet.version} §${clause.id}`,
    severity: clause.severity, status: 'not-applicable', location: t.location, actual: null, limit: null, unit: '',
    utilisation: null, utilisationBasis: null, message: 'does not apply here', warnings: [],
  };
  if (outcome.error !== null) return { ...row, status: 'error', message: `could not be evaluated: ${outcome.error}` };
  if (!outcome.applies) return row;
  row.warnings = warningsFor(clause, t);
  let v: Measured | null;
  try {
    v = measured(ruleSet, clause, t, params, units);
  } catch (err) {
    return { ...row, status: 'error', message: `could not be evaluated: ${err instanceof Error ? err.message : String(err)}` };
  }
  const passes = outcome.passes === true;
  const status: RowStatus = passes ? 'pass' : 'fail';
  if (!v) return { ...row, status, message: `requirement ${passes ? 'met' : 'not met'}: ${clause.title}` };
  const u = utilisationOf(clause, v);
  const filled = { ...row, status, actual: v.actual, limit: v.limit, unit: v.unit, utilisation: u,
    utilisationBasis: clause.measure!.sense === 'at-most' ? 'actual/limit' as const : 'limit/actual' as const, message: measureText(clause, v, passes, u) };
  if (contradicts(clause, v, passes)) {
    return { ...filled, status: 'error', message: `the check passed but the measure is past its limit (${filled.message}): the clause's check and measure disagree` };
  }
  return filled;
}

import { fromSI, type UnitSystem } from '../engine';
import { PLAIN_QUANTITIES } from './fact-registry';
import type { ChecklistRow } from './checklist-types';
import type { Facts } from './facts';
import { withinLimit } from './limit-tolerance';
import type { Target } from './locations';
import type { PreparedMeasure } from './prepared-rule-set';
import { shortNumber } from './short-number';

/* A clause's measure at one location: actual against limit in the calc's units, utilisation and its sentence. */

interface Measured {
  actual: number | null;
  limit: number | null;
  unit: string;
}

const has = (o: object, k: string): boolean => Object.prototype.hasOwnProperty.call(o, k);

function lookup(name: string, facts: Facts, params: Facts): number | null {
  const v = has(facts, name) ? facts[name] : has(params, name) ? params[name] : undefined;
  if (v === undefined) throw new Error(`measure: Undefined fact: ${name}`);
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
}

/** Actual and limit of the measure, converted from SI to the calc's units (throws on an unknown name). */
function measured(m: PreparedMeasure, facts: Facts, params: Facts, units: UnitSystem): Measured {
  const isPlain = units === 'SI' || PLAIN_QUANTITIES.has(m.quantity);
  const q = m.quantity as 'length' | 'torque' | 'stress' | 'modulus' | 'twistPerLength';
  const shown = (v: number | null): number | null => (v === null || isPlain ? v : fromSI(v, q, units));
  return {
    actual: shown(lookup(m.actual, facts, params)),
    limit: shown(lookup(m.limit, facts, params)),
    unit: m.unit[units],
  };
}

function utilisationOf(m: PreparedMeasure, v: Measured): number | null {
  if (v.actual === null || v.limit === null) return null;
  const u = m.isAtMost ? (v.limit > 0 ? v.actual / v.limit : null) : v.actual > 0 ? v.limit / v.actual : null;
  return u !== null && Number.isFinite(u) ? u : null;
}

const withUnit = (v: number, unit: string): string => (unit === '1' ? shortNumber(v) : `${shortNumber(v)} ${unit}`);

function measureText(m: PreparedMeasure, v: Measured, passes: boolean, u: number | null): string {
  if (v.actual === null || v.limit === null)
    return `${m.label} is not available here (no load or no data); requirement ${passes ? 'met' : 'not met'}`;
  const verb = m.isAtMost
    ? passes
      ? 'is within the limit of'
      : 'exceeds the limit of'
    : passes
      ? 'meets the minimum of'
      : 'is below the minimum of';
  const util =
    u === null ? '' : ` (utilisation ${shortNumber(100 * u, 3)} %, ${m.isAtMost ? 'actual/limit' : 'limit/actual'})`;
  return `${m.label} ${withUnit(v.actual, v.unit)} ${verb} ${withUnit(v.limit, v.unit)}${util}`;
}

// A check that passes while its own measure is past the limit (beyond the tolerance the checks
// themselves use) means the clause is inconsistent.
function contradicts(m: PreparedMeasure, v: Measured, passes: boolean): boolean {
  if (!passes || v.actual === null || v.limit === null) return false;
  return !withinLimit(v.actual, v.limit, m.isAtMost);
}

/** Fills the row's actual, limit, unit, utilisation and sentence from the measure (throws on an unknown name). */
export function fillMeasure(
  row: ChecklistRow,
  m: PreparedMeasure,
  t: Target,
  params: Facts,
  units: UnitSystem,
  passes: boolean,
): void {
  const v = measured(m, t.facts, params, units);
  const u = utilisationOf(m, v);
  row.actual = v.actual;
  row.limit = v.limit;
  row.unit = v.unit;
  row.utilisation = u;
  row.utilisationBasis = m.isAtMost ? 'actual/limit' : 'limit/actual';
  row.message = measureText(m, v, passes, u);
  if (contradicts(m, v, passes)) {
    row.status = 'error';
    row.message = `the check passed but the measure is past its limit (${row.message}): the clause's check and measure disagree`;
  }
}

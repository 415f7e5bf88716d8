import { isFactCondition, isFactRef, type Condition, type TopCondition } from './condition-schema';
import type { Facts } from './facts';
import type { Clause } from './rule-set-schema';

const NAMES = new WeakMap<Clause, readonly string[]>();

function collect(c: Condition | TopCondition, out: Set<string>): void {
  if (isFactCondition(c)) {
    out.add(c.fact);
    if (isFactRef(c.value)) out.add(c.value.fact);
    return;
  }
  if ('all' in c) c.all.forEach((x) => collect(x, out));
  else if ('any' in c) c.any.forEach((x) => collect(x, out));
  else collect(c.not, out);
}

/** Every fact a clause reads: in its applicability, its check and its measure. */
export function factsOfClause(clause: Clause): readonly string[] {
  let names = NAMES.get(clause);
  if (!names) {
    const out = new Set<string>();
    collect(clause.applicability, out);
    collect(clause.check, out);
    if (clause.measure) out.add(clause.measure.actual).add(clause.measure.limit);
    names = [...out];
    NAMES.set(clause, names);
  }
  return names;
}

const isBadNumber = (v: unknown): boolean => typeof v === 'number' && !Number.isFinite(v);

/**
 * The first fact the clause reads whose value is Infinity or NaN (directly, or a field of an
 * object fact such as fatigueSafetyBy), or null. Comparisons with such a value answer "false",
 * which would turn a clause into "not applicable" or a pass: the row must be an error instead.
 */
export function nonFiniteFact(clause: Clause, facts: Facts, params: Facts): string | null {
  for (const name of factsOfClause(clause)) {
    const own = Object.hasOwn(facts, name) ? facts[name] : Object.hasOwn(params, name) ? params[name] : undefined;
    if (isBadNumber(own)) return `${name} (${String(own)})`;
    if (own && typeof own === 'object') {
      const bad = Object.entries(own).find(([, v]) => isBadNumber(v));
      if (bad) return `${name}.${bad[0]} (${String(bad[1])})`;
    }
  }
  return null;
}

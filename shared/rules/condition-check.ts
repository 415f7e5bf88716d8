import {
  isFactCondition,
  isFactRef,
  type Condition,
  type FactCondition,
  type Scalar,
  type TopCondition,
} from './condition-schema';
import { refType, type CheckContext, type RefType } from './fact-types';
import type { Clause } from './rule-set-schema';

/*
 * Type checks of a clause's conditions and measure against the fact registry and the rule set's
 * parameters: known names, numbers compared with numbers in the same SI unit, literals of the
 * fact's type and allowed values, and the parameters derived facts are computed from.
 */
const NUMERIC = new Set(['lessThan', 'lessThanInclusive', 'greaterThan', 'greaterThanInclusive']);

function scalarType(v: Scalar): string {
  return v === null ? 'null' : typeof v;
}

function checkNeeds(t: RefType, at: string, ctx: CheckContext): void {
  for (const name of t.needs ?? []) {
    const p = ctx.params.get(name);
    if (!p)
      ctx.out.push({
        path: at,
        message: `${t.what} is computed from parameter "${name}", which the rule set does not define`,
      });
    else if (typeof p.value !== 'number' || p.unit !== (t.unit === 'rad' ? 'rad' : '1')) {
      // A derived limit (allowableSlope) carries the unit of its parameters; the ASME fractions are dimensionless.
      const unit = t.unit === 'rad' ? 'rad' : '1';
      ctx.out.push({ path: at, message: `${t.what} needs parameter "${name}" as a number in unit "${unit}"` });
    }
  }
}

function resolve(fact: string, path: string | undefined, at: string, ctx: CheckContext): RefType | null {
  const t = refType(fact, path, at, ctx);
  if (t) checkNeeds(t, at, ctx);
  return t;
}

function checkLiteral(left: RefType, v: Scalar, at: string, ctx: CheckContext): void {
  if (v === null) {
    if (!left.isNullable) ctx.out.push({ path: at, message: `${left.what} is never null` });
  } else if (left.type === 'object' || scalarType(v) !== left.type) {
    ctx.out.push({
      path: at,
      message: `${left.what} is ${left.type === 'object' ? 'an object (compare it with null, or add a path)' : `a ${left.type}`}, got ${JSON.stringify(v)}`,
    });
  } else if (left.values && typeof v === 'string' && !left.values.includes(v)) {
    ctx.out.push({ path: at, message: `"${v}" is not a value of ${left.what} (${left.values.join(', ')})` });
  }
}

function checkNumeric(c: FactCondition, left: RefType, right: RefType | null, p: string, ctx: CheckContext): void {
  if (left.type !== 'number') {
    ctx.out.push({
      path: `${p}.operator`,
      message: `${c.operator} compares numbers, but ${left.what} is a ${left.type}`,
    });
    return;
  }
  if (!isFactRef(c.value)) {
    if (typeof c.value !== 'number')
      ctx.out.push({ path: `${p}.value`, message: `${c.operator} needs a number, got ${JSON.stringify(c.value)}` });
    return;
  }
  if (!right) return;
  if (right.type !== 'number')
    ctx.out.push({
      path: `${p}.value.fact`,
      message: `${right.what} is a ${right.type}, but ${c.operator} needs a number`,
    });
  else if (right.unit !== null && left.unit !== null && right.unit !== left.unit) {
    ctx.out.push({
      path: `${p}.value.fact`,
      message: `${right.what} is in ${right.unit} but ${left.what} is in ${left.unit} (rule sets use SI units)`,
    });
  }
}

function checkEquality(c: FactCondition, left: RefType, right: RefType | null, p: string, ctx: CheckContext): void {
  const v = c.value;
  if (c.operator === 'contains' || c.operator === 'doesNotContain') {
    ctx.out.push({
      path: `${p}.operator`,
      message: `${c.operator} needs a list fact, and ${left.what} is a ${left.type}`,
    });
  } else if (c.operator === 'in' || c.operator === 'notIn') {
    if (!Array.isArray(v)) ctx.out.push({ path: `${p}.value`, message: `${c.operator} needs a list of values` });
    else v.forEach((x, k) => checkLiteral(left, x, `${p}.value[${k}]`, ctx));
  } else if (Array.isArray(v)) {
    ctx.out.push({ path: `${p}.value`, message: `${c.operator} compares single values; use "in" for a list` });
  } else if (isFactRef(v)) {
    if (right && right.type !== left.type)
      ctx.out.push({
        path: `${p}.value.fact`,
        message: `${right.what} is a ${right.type}, but ${left.what} is a ${left.type}`,
      });
  } else {
    checkLiteral(left, v, `${p}.value`, ctx);
  }
}

function checkFactCondition(c: FactCondition, p: string, ctx: CheckContext): void {
  const left = resolve(c.fact, c.path, `${p}.fact`, ctx);
  const right = isFactRef(c.value) ? resolve(c.value.fact, c.value.path, `${p}.value.fact`, ctx) : null;
  if (!left) return;
  if (NUMERIC.has(c.operator)) checkNumeric(c, left, right, p, ctx);
  else checkEquality(c, left, right, p, ctx);
}

/** Walks a condition tree; `p` is the path of the condition, e.g. `clauses[3].check`. */
export function checkCondition(c: Condition | TopCondition, p: string, ctx: CheckContext): void {
  if ('all' in c) c.all.forEach((x, i) => checkCondition(x, `${p}.all[${i}]`, ctx));
  else if ('any' in c) c.any.forEach((x, i) => checkCondition(x, `${p}.any[${i}]`, ctx));
  else if ('not' in c) checkCondition(c.not, `${p}.not`, ctx);
  else if (isFactCondition(c)) checkFactCondition(c, p, ctx);
}

/** The measure names a numeric actual fact and a numeric limit in the same SI unit as `unit`. */
export function checkMeasure(clause: Clause, p: string, ctx: CheckContext): void {
  const m = clause.measure;
  if (!m) return;
  const actual = m.actual.startsWith('param:') ? null : resolve(m.actual, undefined, `${p}.actual`, ctx);
  if (m.actual.startsWith('param:'))
    ctx.out.push({ path: `${p}.actual`, message: 'the actual value must be a fact of the calc, not a parameter' });
  const limit = resolve(m.limit, undefined, `${p}.limit`, ctx);
  for (const [t, at] of [
    [actual, `${p}.actual`],
    [limit, `${p}.limit`],
  ] as const) {
    if (t && t.type !== 'number')
      ctx.out.push({ path: at, message: `${t.what} is a ${t.type}; a measure needs numbers` });
  }
  if (actual?.type === 'number' && actual.unit !== m.unit)
    ctx.out.push({ path: `${p}.unit`, message: `${actual.what} is in ${actual.unit}, not ${JSON.stringify(m.unit)}` });
  if (actual?.type === 'number' && limit?.type === 'number' && limit.unit !== null && limit.unit !== actual.unit) {
    ctx.out.push({
      path: `${p}.limit`,
      message: `${limit.what} is in ${limit.unit} but ${actual.what} is in ${actual.unit}`,
    });
  }
}

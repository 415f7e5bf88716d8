import { isFactCondition, isFactRef, type Condition, type FactCondition, type TopCondition } from './condition-schema';
import type { Facts } from './facts';
import { TOLERANT_OPERATORS } from './limit-tolerance';

/*
 * Synchronous evaluator of the same condition JSON that json-rules-engine 7.3.1 runs, for bulk work
 * (impact analysis, minimum-diameter search). It copies the engine's semantics on purpose:
 * - operators: the same callbacks and fact-value validators (engine-default-operators.js), except
 *   that the four ordering operators compare with the tolerance of limit-tolerance.ts, which
 *   engine-runner.ts installs in json-rules-engine too;
 * - all/any: an empty list is true, one entry is that entry, otherwise every entry is evaluated
 *   (no short-circuit, so an entry that throws makes the whole condition throw) and then
 *   every/some decide; not negates its single entry;
 * - facts: run-time facts first, then parameters; an unknown name throws "Undefined fact: x";
 * - path "$.name": an own property of an object value; a non-object value passes through.
 * Tests prove it gives the engine's results on every shipped clause and on generated cases.
 */
export type Compiled = (facts: Facts, params: Facts) => boolean;

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- untyped JSON operands, as in limit-tolerance.ts
type Op = { cb: (a: any, b: any) => boolean; validator: (a: unknown) => boolean };

const anyValue = (): boolean => true;
// The engine's check: parseFloat of the fact value must not print as NaN.
const isNumberLike = (v: unknown): boolean => Number.parseFloat(v as string).toString() !== 'NaN';

const OPS: Readonly<Record<string, Op>> = {
  equal: { cb: (a, b) => a === b, validator: anyValue },
  notEqual: { cb: (a, b) => a !== b, validator: anyValue },
  in: { cb: (a, b) => b.indexOf(a) > -1, validator: anyValue },
  notIn: { cb: (a, b) => b.indexOf(a) === -1, validator: anyValue },
  contains: { cb: (a, b) => a.indexOf(b) > -1, validator: Array.isArray },
  doesNotContain: { cb: (a, b) => a.indexOf(b) === -1, validator: Array.isArray },
  lessThan: { cb: TOLERANT_OPERATORS.lessThan, validator: isNumberLike },
  lessThanInclusive: { cb: TOLERANT_OPERATORS.lessThanInclusive, validator: isNumberLike },
  greaterThan: { cb: TOLERANT_OPERATORS.greaterThan, validator: isNumberLike },
  greaterThanInclusive: { cb: TOLERANT_OPERATORS.greaterThanInclusive, validator: isNumberLike },
};

const has = (o: object, k: string): boolean => Object.prototype.hasOwnProperty.call(o, k);

function factValue(name: string, path: string | undefined, facts: Facts, params: Facts): unknown {
  let value: unknown;
  if (has(facts, name)) value = facts[name];
  else if (has(params, name)) value = params[name];
  else throw new Error(`Undefined fact: ${name}`);
  if (!path || value === null || typeof value !== 'object') return value;
  const key = path.slice(2);
  return has(value, key) ? (value as Record<string, unknown>)[key] : undefined;
}

function compileFact(c: FactCondition): Compiled {
  const op = has(OPS, c.operator) ? OPS[c.operator] : undefined;
  const { fact, path, value } = c;
  if (!op)
    return () => {
      throw new Error(`Unknown operator: ${c.operator}`);
    };
  if (isFactRef(value)) {
    return (facts, params) => {
      const right = factValue(value.fact, value.path, facts, params);
      const left = factValue(fact, path, facts, params);
      return op.validator(left) && op.cb(left, right);
    };
  }
  return (facts, params) => {
    const left = factValue(fact, path, facts, params);
    return op.validator(left) && op.cb(left, value);
  };
}

function compileList(list: Condition[], isAll: boolean): Compiled {
  if (list.length === 0) return () => true;
  if (list.length === 1) return compileCondition(list[0]);
  const parts = list.map(compileCondition);
  return (facts, params) => {
    const results = parts.map((p) => p(facts, params));
    return isAll ? results.every((r) => r === true) : results.some((r) => r === true);
  };
}

/** Compiles a condition once; the returned function is called per location. */
export function compileCondition(c: Condition | TopCondition): Compiled {
  // Same precedence as the engine's Condition.booleanOperator: any, all, not, then a fact condition.
  if (has(c, 'any')) return compileList((c as { any: Condition[] }).any, false);
  if (has(c, 'all')) return compileList((c as { all: Condition[] }).all, true);
  if (has(c, 'not')) {
    const inner = compileCondition((c as { not: Condition }).not);
    return (facts, params) => !inner(facts, params);
  }
  if (isFactCondition(c as Condition)) return compileFact(c as FactCondition);
  throw new Error('Condition: constructor "fact" property required');
}

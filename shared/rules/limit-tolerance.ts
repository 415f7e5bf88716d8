/*
 * Comparisons at a limit. A safety factor that is 2 by construction can come out 1.9999999999999996
 * after a dozen floating-point operations; letting that rounding decide "fails, minimum 2" is wrong.
 * Every comparison of a calc value with a limit (clause checks in json-rules-engine and in the
 * synchronous evaluator, the checklist's own consistency check, and so the minimum-diameter search
 * and the impact analysis, which use the checklist) treats two numbers within LIMIT_TOLERANCE of
 * each other, relative to the larger magnitude, as equal. 1e-9 is a million times the rounding of
 * a chain of double-precision operations (about 1e-15) and a thousand times finer than the 6
 * significant digits results are printed with, so it never decides a real case.
 * Common practice, no source (docs/references.md, "Comparing at a limit").
 */
export const LIMIT_TOLERANCE = 1e-9;

/** True when a and b differ by no more than LIMIT_TOLERANCE of the larger magnitude. */
export function nearlyEqual(a: number, b: number): boolean {
  return Math.abs(a - b) <= LIMIT_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));
}

// Operands are untyped JSON facts compared with JavaScript's own operators, exactly as json-rules-engine does.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Order = (a: any, b: any) => boolean;

// Two finite numbers within the tolerance count as equal (`atEqual` says whether that passes);
// anything else (a number-like string, say) compares exactly as json-rules-engine's defaults do.
function tolerant(exact: Order, atEqual: boolean): Order {
  return (a, b) => {
    if (typeof a === 'number' && typeof b === 'number' && Number.isFinite(a) && Number.isFinite(b) && nearlyEqual(a, b))
      return atEqual;
    return exact(a, b);
  };
}

/** The four ordering operators with the tolerance, for json-rules-engine and the synchronous evaluator. */
export const TOLERANT_OPERATORS: Readonly<
  Record<'greaterThanInclusive' | 'lessThanInclusive' | 'greaterThan' | 'lessThan', Order>
> = {
  greaterThanInclusive: tolerant((a, b) => a >= b, true),
  lessThanInclusive: tolerant((a, b) => a <= b, true),
  greaterThan: tolerant((a, b) => a > b, false),
  lessThan: tolerant((a, b) => a < b, false),
};

/** actual meets a minimum (isAtMost false) or stays within a maximum (isAtMost true), with the tolerance. */
export function withinLimit(actual: number, limit: number, isAtMost: boolean): boolean {
  return isAtMost
    ? TOLERANT_OPERATORS.lessThanInclusive(actual, limit)
    : TOLERANT_OPERATORS.greaterThanInclusive(actual, limit);
}

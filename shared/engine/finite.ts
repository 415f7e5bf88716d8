import { CalcInputError } from './validate';

/*
 * "null" in a result means "no load here" (an infinite safety factor cannot go in JSON). An
 * overflow must never reach that meaning: a NaN or Infinity met on the way is an error that names
 * where it arose, never a null. The range checks (check-ranges.ts) keep valid input away from
 * this; these are the backstop.
 */
export class NonFiniteError extends Error {
  constructor(what: string) {
    super(`${what} is not a finite number`);
    this.name = 'NonFiniteError';
  }
}

/** The value, or a NonFiniteError naming `what` when it is NaN or ±Infinity. */
export function finite(value: number, what: string): number {
  if (!Number.isFinite(value)) throw new NonFiniteError(`${what} (${value})`);
  return value;
}

// Result paths are reported against the input entry that produced them (segments[2], features[0]).
function inputPathOf(resultPath: string): string {
  const m = /^(segments|features)\[\d+\]/.exec(resultPath);
  return m ? m[0] : resultPath.startsWith('torque') ? 'torques' : '(input)';
}

// Fast pass without paths (this runs on every evaluation, i.e. on every keystroke in the editor).
function allFinite(value: unknown): boolean {
  if (typeof value === 'number') return Number.isFinite(value);
  if (value === null || typeof value !== 'object') return true;
  if (Array.isArray(value)) {
    for (const item of value) if (!allFinite(item)) return false;
    return true;
  }
  for (const key in value) if (!allFinite((value as Record<string, unknown>)[key])) return false;
  return true;
}

// Slow pass, only once something is known to be wrong: the path of the first bad number.
function firstNonFinite(value: unknown, path: string): string | null {
  if (allFinite(value)) return null;
  if (typeof value === 'number') return path;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = firstNonFinite(value[i], `${path}[${i}]`);
      if (found) return found;
    }
    return null;
  }
  for (const key in value as object) {
    const found = firstNonFinite((value as Record<string, unknown>)[key], path ? `${path}.${key}` : key);
    if (found) return found;
  }
  return null;
}

const ADVICE = 'the entered magnitudes are beyond what the engine can compute; check the values and their units';
// Parts of a result that hold text only (units, formulas, messages): nothing to check there.
const TEXT_ONLY = new Set(['fields', 'methods', 'caution', 'warnings', 'engineVersion', 'units']);

/** Throws CalcInputError when any number in `result` is NaN or ±Infinity. */
export function assertFiniteResult(result: object): void {
  for (const key in result) {
    if (TEXT_ONLY.has(key)) continue;
    const at = firstNonFinite((result as Record<string, unknown>)[key], key);
    if (at)
      throw new CalcInputError([
        { path: inputPathOf(at), message: `the result ${at} is not a finite number: ${ADVICE}` },
      ]);
  }
}

/** Runs `compute`; a NonFiniteError inside becomes a CalcInputError on `path`. */
export function guarded<T>(path: string, compute: () => T): T {
  try {
    return compute();
  } catch (e) {
    if (e instanceof NonFiniteError) throw new CalcInputError([{ path, message: `${e.message}: ${ADVICE}` }]);
    throw e;
  }
}

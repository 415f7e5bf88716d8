import type { Verification } from './verification-schema';
import { shortNumber } from './short-number';

/** A fraction as a percentage for people: 0.02 → "2 %", 0.001 → "0.1 %". */
function percent(fraction: number): string {
  return `${shortNumber(fraction * 100, 3)} %`;
}

/**
 * How a standard asks calcs to be checked, in plain words, one line per aspect (the rule-set
 * view lists them; the comparison shows a changed line when a requirement or tolerance changes).
 * Absent verification: review alone.
 */
export function verificationLines(
  v: Verification | undefined,
): Record<'requirement' | 'inputs' | 'results' | 'origin', string> {
  if (!v)
    return {
      requirement: 'Checked by review alone; no independent model required',
      inputs: '—',
      results: '—',
      origin: '—',
    };
  const scope =
    v.scope.kind === 'all'
      ? 'for every calc under this standard'
      : `for calcs with largest external torque ≥ ${shortNumber(v.scope.value)} N·m`;
  return {
    requirement: `Independent model required ${scope}`,
    inputs: `Inputs equal after unit conversion when within ${percent(v.tolerances.inputs)}`,
    results: `Results agree when within ${percent(v.tolerances.results)}`,
    origin: v.origin,
  };
}

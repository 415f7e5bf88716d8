import type { Checklist, ChecklistRow, RuleSet } from '../rules';
import { formatBeside, formatEng } from './engineering';

export type HeadlineOutcome = 'pass' | 'fail' | 'advisory-fail' | 'unchecked';

export interface HeadlineMark {
  outcome: HeadlineOutcome;
  /** The value as text, with enough digits to show which side of its limit it sits on. */
  text: string;
  /** "min 1.5 (§5.3)", or '' when no clause measures this figure. */
  limitText: string;
}

const RANK: Record<HeadlineOutcome, number> = { unchecked: 0, pass: 1, 'advisory-fail': 2, fail: 3 };

/**
 * A headline figure (lowest fatigue safety, largest shear …) marked by the clause rows that
 * measure the same fact: a mandatory failure anywhere marks it failed, an advisory one marks it as
 * a warning. The limit printed is the governing row's, the one nearest to failing.
 */
export function headlineMark(
  value: number | null | undefined,
  fact: string,
  checklist: Checklist | null,
  ruleSet: RuleSet | null,
  sig = 3,
): HeadlineMark {
  const clauses = new Map(
    (ruleSet?.clauses ?? []).filter((c) => c.measure?.actual === fact).map((c) => [c.id, c.measure!]),
  );
  const rows = (checklist?.rows ?? []).filter((r) => clauses.has(r.clauseId) && r.status !== 'not-applicable');
  let outcome: HeadlineOutcome = 'unchecked';
  let governing: ChecklistRow | null = null;
  for (const r of rows) {
    const o: HeadlineOutcome = r.status === 'pass' ? 'pass' : r.severity === 'advisory' ? 'advisory-fail' : 'fail';
    if (RANK[o] > RANK[outcome]) outcome = o;
    if (r.utilisation !== null && (!governing || (governing.utilisation ?? 0) < r.utilisation)) governing = r;
  }
  if (value === null || value === undefined || !governing || governing.limit === null) {
    return { outcome, text: formatEng(value, sig), limitText: '' };
  }
  const pair = formatBeside(value, governing.limit, sig);
  const sense = clauses.get(governing.clauseId)!.sense === 'at-least' ? 'min' : 'max';
  return { outcome, text: pair.actual, limitText: `${sense} ${pair.limit} (§${governing.clauseId})` };
}

import type { Checklist, ChecklistCounts, ChecklistRow, ManualRow, ManualState } from './checklist-types';
import type { MethodIssue } from './rule-set-methods';
import type { RuleSet } from './rule-set-schema';

function countRows(rows: readonly ChecklistRow[]): ChecklistCounts {
  const c: ChecklistCounts = {
    rows: rows.length,
    pass: 0,
    fail: 0,
    notApplicable: 0,
    error: 0,
    mandatoryFail: 0,
    mandatoryError: 0,
    advisoryFail: 0,
    advisoryError: 0,
  };
  for (const r of rows) {
    if (r.status === 'pass') c.pass++;
    else if (r.status === 'not-applicable') c.notApplicable++;
    else {
      c[r.status === 'fail' ? 'fail' : 'error']++;
      const key = `${r.severity}${r.status === 'fail' ? 'Fail' : 'Error'}` as
        'mandatoryFail' | 'mandatoryError' | 'advisoryFail' | 'advisoryError';
      c[key]++;
    }
  }
  return c;
}

const plural = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`;

/** Counts and verdict: compliant when no mandatory row fails or errors and no method differs. */
export function summarize(
  rows: readonly ChecklistRow[],
  methodIssues: readonly MethodIssue[],
): Pick<Checklist, 'counts' | 'verdict' | 'verdictReasons'> {
  const counts = countRows(rows);
  const reasons: string[] = [];
  if (counts.mandatoryFail)
    reasons.push(`${plural(counts.mandatoryFail, 'mandatory row fails', 'mandatory rows fail')}`);
  if (counts.mandatoryError)
    reasons.push(`${plural(counts.mandatoryError, 'mandatory row', 'mandatory rows')} could not be evaluated`);
  if (methodIssues.length)
    reasons.push(`${plural(methodIssues.length, 'method differs', 'methods differ')} from the rule set's choice`);
  return { counts, verdict: reasons.length ? 'not-compliant' : 'compliant', verdictReasons: reasons };
}

/** The rule set's manual items with the checker's state; state for unknown items becomes a note. */
export function manualRows(
  ruleSet: RuleSet,
  state: Record<string, ManualState> = {},
): { manual: ManualRow[]; notes: string[] } {
  const manual = ruleSet.manualItems.map((m): ManualRow => {
    const s = Object.prototype.hasOwnProperty.call(state, m.id) ? state[m.id] : undefined;
    return {
      id: m.id,
      text: m.text,
      requiresAttachment: m.requiresAttachment ?? null,
      done: s?.done === true,
      by: s?.by ?? null,
      note: s?.note ?? null,
    };
  });
  const notes = Object.keys(state)
    .filter((id) => !ruleSet.manualItems.some((m) => m.id === id))
    .map((id) => `manual item "${id}" is not in ${ruleSet.code} v${ruleSet.version}; its state was ignored`);
  return { manual, notes };
}

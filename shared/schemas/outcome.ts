/**
 * The compact part of a checklist that impact analysis compares: the verdict and the mandatory
 * rows that fail or error, keyed by clause and location. Stored beside each revision so that
 * re-evaluating thousands of revisions never has to read their full checklists back.
 */
export interface OutcomeSummary {
  verdict: string | null;
  failing: string[];
}

interface RowLike {
  clauseId: string;
  severity: string;
  status: string;
  location?: { label?: string };
}

export function outcomeOf(checklist: { verdict: string; rows: RowLike[] } | null): OutcomeSummary {
  if (!checklist) return { verdict: null, failing: [] };
  const failing = checklist.rows
    .filter((r) => r.severity === 'mandatory' && (r.status === 'fail' || r.status === 'error'))
    .map((r) => `${r.clauseId}|${r.location?.label ?? ''}|${r.status}`);
  return { verdict: checklist.verdict, failing };
}

import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';

export interface FindingCounts {
  open: number;
  answered: number;
  closed: number;
}

/**
 * One count of findings for the tab, the status line and the buttons, so they never disagree:
 * "open" waits for the author's answer, "answered" waits for a reviewer to close it.
 */
export function countFindings(r: Pick<RevisionDto, 'findings'>): FindingCounts {
  const counts: FindingCounts = { open: 0, answered: 0, closed: 0 };
  for (const f of r.findings) counts[f.status as keyof FindingCounts] += 1;
  return counts;
}

export function findingsTabLabel(c: FindingCounts): string {
  const parts = [c.open ? `${c.open} open` : '', c.answered ? `${c.answered} answered` : ''].filter(Boolean);
  if (parts.length) return `Findings (${parts.join(', ')})`;
  return c.closed ? `Findings (${c.closed} closed)` : 'Findings';
}

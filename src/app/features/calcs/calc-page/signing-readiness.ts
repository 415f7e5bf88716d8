import type { Checklist, ChecklistRow } from '../../../../../shared/rules';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { countFindings } from './finding-counts';

export type Meaning = 'authored' | 'checked' | 'approved';

export interface SigningReadiness {
  /** Reasons the server will refuse this signature; shown before any password is asked for. */
  blockers: string[];
  /** Mandatory clause rows that fail: the author may still submit, but must see it first. */
  failingMandatory: ChecklistRow[];
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/**
 * Mirrors the server's signing rules (server/workflow/independence.ts) for what is visible on the
 * revision: open manual items, open or unanswered findings, a calc that fails its standard. The
 * server still decides; this only saves the signer from typing a password for a certain refusal.
 */
export function signingReadiness(r: RevisionDto, meaning: Meaning): SigningReadiness {
  const checklist = r.checklist as Checklist | null;
  const failingMandatory = (checklist?.rows ?? []).filter((row) => row.severity === 'mandatory' && (row.status === 'fail' || row.status === 'error'));
  const { open, answered } = countFindings(r);
  const blockers: string[] = [];
  if (meaning === 'authored') {
    if (!r.result) blockers.push('The calc has input errors: fix them before submitting.');
    if (open) blockers.push(`Answer the ${plural(open, 'open finding')} first.`);
    return { blockers, failingMandatory };
  }
  if (r.verdict !== 'compliant') blockers.push('The calc does not meet its standard: return it to the author instead of signing it.');
  if (meaning === 'checked') {
    const manualOpen = (checklist?.manual ?? []).filter((m) => !r.manualItems[m.id]?.done).length;
    if (manualOpen) blockers.push(`Tick the ${plural(manualOpen, 'open manual checklist item')} first.`);
    if (open) blockers.push(`${plural(open, 'finding is', 'findings are')} still open: return the calc to its author instead.`);
  }
  if (meaning === 'approved' && open + answered) blockers.push(`${plural(open + answered, 'finding is', 'findings are')} not closed yet.`);
  return { blockers, failingMandatory };
}

/** "§6.1 Fatigue safety at KS1 (1.497 < 1.5)" for the author's warning. */
export function failingRowText(row: ChecklistRow): string {
  return `§${row.clauseId} ${row.clauseTitle}, ${row.location.label}${row.message ? `: ${row.message}` : ''}`;
}

import type { Checklist, ChecklistRow } from '../../../../../shared/rules';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import type { SessionUser } from '../../../../../shared/schemas/auth.schema';
import type { Meaning } from '../../../../../shared/workflow/revision-states';
import { signingBlockers } from '../../../../../shared/workflow/signing-blockers';
import { signingContextOf } from '../../../../../shared/workflow/revision-facts';

export type { Meaning };

export interface SigningReadiness {
  /** Reasons the server will refuse this signature; shown before any password is asked for. */
  blockers: string[];
  /** Mandatory clause rows that fail: the author may still submit, but must see it first. */
  failingMandatory: ChecklistRow[];
}

/** Mandatory clause rows that fail or could not be evaluated. */
export function failingMandatoryRows(r: RevisionDto): ChecklistRow[] {
  const checklist = r.checklist as Checklist | null;
  return (checklist?.rows ?? []).filter(
    (row) => row.severity === 'mandatory' && (row.status === 'fail' || row.status === 'error'),
  );
}

/**
 * The server's content blockers (shared/workflow/signing-blockers.ts) for what is visible on the
 * revision: open manual items, open or unanswered findings, a calc that fails its standard. Who may
 * sign is settled before the dialog opens (revision-actions.ts). The server still decides; this only
 * saves the signer from typing a password for a certain refusal.
 */
export function signingReadiness(r: RevisionDto, meaning: Meaning, me: SessionUser | null = null): SigningReadiness {
  const actor = { id: me?.id ?? 0, roles: me?.roles ?? [] };
  const blockers = signingBlockers(meaning, signingContextOf(r, actor), 'content').map((b) => `${b.message}.`);
  return { blockers, failingMandatory: failingMandatoryRows(r) };
}

/** "§6.1 Fatigue safety at KS1 (1.497 < 1.5)" for the author's warning. */
export function failingRowText(row: ChecklistRow): string {
  return `§${row.clauseId} ${row.clauseTitle}, ${row.location.label}${row.message ? `: ${row.message}` : ''}`;
}

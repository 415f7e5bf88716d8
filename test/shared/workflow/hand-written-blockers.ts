// The signing rules as they were written by hand before the workflow table; kept frozen for signing-blockers.spec.ts.
import type { Role } from '../../../shared/authz/roles';
import type { RevisionState } from '../../../shared/schemas/revision.schema';

export type Meaning = 'authored' | 'checked' | 'approved';

export interface SigningContext {
  actor: { id: number; roles: readonly Role[] };
  revision: {
    status: RevisionState;
    authorId: number;
    checkerId: number | null;
    hasResult: boolean;
    verdict: string | null;
    errorRows: number;
  };
  editorIds: readonly number[];
  openFindings: number;
  unresolvedFindings: number;
  openManualItems: number;
}

const ROLE_FOR: Record<Meaning, Role> = { authored: 'author', checked: 'checker', approved: 'approver' };
const STATE_FOR: Record<Meaning, readonly RevisionState[]> = {
  authored: ['draft', 'returned'],
  checked: ['in_check'],
  approved: ['checked'],
};

/**
 * Why this person may not sign with this meaning now, or null when they may. Separation of
 * duties is enforced here, on the server, whatever the client shows: nobody checks or approves
 * a calc they ever edited, a checker never approves what they checked, and a signature is always
 * the signer's own (the caller passes the signed-in person, never a name from the request).
 */
export function handWrittenSigningBlocker(meaning: Meaning, c: SigningContext): string | null {
  const { actor, revision } = c;
  if (!actor.roles.includes(ROLE_FOR[meaning])) return `Signing as ${meaning} needs the ${ROLE_FOR[meaning]} role`;
  if (!STATE_FOR[meaning].includes(revision.status))
    return `A ${revision.status.replace('_', ' ')} revision cannot be signed as ${meaning}`;
  // Whatever its severity, a row that could not be evaluated is a check nobody has made.
  if (revision.errorRows > 0)
    return `${revision.errorRows} checklist row(s) could not be evaluated; nobody can sign this revision until every row has a result`;
  if (meaning === 'authored') {
    if (actor.id !== revision.authorId) return 'Only the author of this revision can sign it as authored';
    if (!revision.hasResult) return 'The calc has input errors; fix them before submitting';
    if (c.openFindings > 0) return `Answer the ${c.openFindings} open finding(s) before resubmitting`;
    return null;
  }
  if (actor.id === revision.authorId || c.editorIds.includes(actor.id)) {
    return `You edited this calc, so you cannot sign it as ${meaning}; independence requires someone else`;
  }
  // A calc that fails a mandatory clause goes back to its author; nobody vouches for it.
  if (revision.verdict !== 'compliant')
    return `The calc does not meet its standard (${revision.verdict ?? 'not evaluated'}); return it to the author instead of signing it as ${meaning}`;
  if (meaning === 'checked' && c.openManualItems > 0)
    return `Tick the ${c.openManualItems} open manual checklist item(s) first`;
  if (meaning === 'checked' && c.openFindings > 0) return 'Open findings remain: return the calc to its author instead';
  if (meaning === 'approved') {
    if (actor.id === revision.checkerId) return 'You checked this revision, so you cannot also approve it';
    if (c.unresolvedFindings > 0) return `Approval is refused while ${c.unresolvedFindings} finding(s) are not closed`;
  }
  return null;
}

import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import type { SessionUser } from '../../../../../shared/schemas/auth.schema';
import { countFindings } from './finding-counts';

export type RevisionAction = 'edit' | 'submit' | 'withdraw' | 'raise-finding' | 'return' | 'sign-checked' | 'approve' | 'new-revision';

export interface ActionPlan {
  actions: Set<RevisionAction>;
  /** What happens next, and why this person can or cannot do it: shown above the buttons. */
  nextStep: string;
}

/**
 * Mirrors the server's workflow rules to decide which buttons to show. The server decides for
 * real on every call; this only keeps people from being offered what they will be refused.
 */
export function planActions(r: RevisionDto, me: SessionUser | null, isLatest: boolean): ActionPlan {
  const actions = new Set<RevisionAction>();
  if (!me) return { actions, nextStep: '' };
  const has = (role: string) => (me.roles as string[]).includes(role);
  const isAuthor = me.id === r.author.id;
  const isEditor = isAuthor || r.editorIds.includes(me.id);
  const { open, answered } = countFindings(r);
  const unresolved = open + answered;
  switch (r.status) {
    case 'draft':
    case 'returned':
      if (isAuthor && has('author')) {
        actions.add('edit').add('withdraw');
        if (r.result && open === 0) actions.add('submit');
      }
      return { actions, nextStep: authorStep(r, isAuthor, open) };
    case 'in_check':
      if (has('checker') && !isEditor) {
        actions.add('raise-finding').add('return');
        if (r.verdict === 'compliant') actions.add('sign-checked');
      }
      if (r.verdict !== 'compliant' && actions.has('return')) return { actions, nextStep: 'The calc fails a mandatory clause of its standard: return it to the author with findings.' };
      return { actions, nextStep: has('checker') && isEditor ? 'Waiting for an independent checker. You edited this calc, so you cannot check it.' : 'Waiting for an independent check.' };
    case 'checked':
      if (has('approver') && !isEditor && r.checker?.id !== me.id) {
        actions.add('raise-finding').add('return');
        if (unresolved === 0 && r.verdict === 'compliant') actions.add('approve');
      }
      return { actions, nextStep: approverStep(r, me.id, isEditor, open, answered) };
    default:
      if (isLatest && has('author') && (r.status === 'approved' || r.status === 'withdrawn')) actions.add('new-revision');
      return { actions, nextStep: r.status === 'approved' ? 'Released. Approved revisions are read-only; a change needs a new revision with a reason.' : `This revision is ${r.status}.` };
  }
}

function authorStep(r: RevisionDto, isAuthor: boolean, open: number): string {
  if (!isAuthor) return `With its author, ${r.author.name}.`;
  if (!r.result) return 'Fix the input errors shown, then submit for check.';
  if (open > 0) return `Answer the ${open} open finding${open === 1 ? '' : 's'}, then resubmit for check.`;
  return 'When the calc is ready, sign it as authored to submit it for independent check.';
}

function approverStep(r: RevisionDto, meId: number, isEditor: boolean, open: number, answered: number): string {
  if (r.checker?.id === meId) return 'Waiting for approval by someone other than its checker.';
  if (isEditor) return 'Waiting for approval. You edited this calc, so you cannot approve it.';
  if (open + answered > 0) {
    const waiting = [open ? `${open} open` : '', answered ? `${answered} answered` : ''].filter(Boolean).join(' and ');
    return `Approval waits until the ${waiting} finding${open + answered === 1 ? ' is' : 's are'} closed.`;
  }
  return 'Checked and ready for approval.';
}

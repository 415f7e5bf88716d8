import { createAppAbility, defineRulesFor } from '../../../../../shared/authz/app-ability';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import type { SessionUser } from '../../../../../shared/schemas/auth.schema';
import { RELATION } from '../../../../../shared/workflow/relations';
import { WORKFLOW, type Meaning, type Turn } from '../../../../../shared/workflow/revision-states';
import { signingBlockers } from '../../../../../shared/workflow/signing-blockers';
import { partiesOfRevision, signingContextOf } from '../../../../../shared/workflow/revision-facts';

export type RevisionAction =
  'edit' | 'submit' | 'withdraw' | 'raise-finding' | 'return' | 'sign-checked' | 'approve' | 'new-revision';

export interface ActionPlan {
  actions: Set<RevisionAction>;
  /** What happens next, and why this person can or cannot do it: shown above the buttons. */
  nextStep: string;
}

/** The button that makes a signature of each meaning. */
const SIGN_BUTTON: Record<Meaning, RevisionAction> = {
  authored: 'submit',
  checked: 'sign-checked',
  approved: 'approve',
};

/** Screen words for a turn: what the revision waits for, and what the holder is told when nothing blocks them. */
const WAITING: Record<Meaning, string> = {
  authored: 'its author',
  checked: 'an independent check',
  approved: 'approval',
};
const READY: Record<Meaning, string> = {
  authored: 'When the calc is ready, sign it as authored to submit it for independent check.',
  checked: 'Waiting for an independent check.',
  approved: 'Checked and ready for approval.',
};
const VERB: Record<Meaning, string> = { authored: 'submit', checked: 'check', approved: 'approve' };

/**
 * Which buttons to offer, read from the workflow table (shared/workflow): the state's turn says who
 * acts and how they must stand to the revision, and the same signing blockers the server applies say
 * whether the signature is offered. The server decides for real on every call.
 */
export function planActions(r: RevisionDto, me: SessionUser | null, isLatest: boolean): ActionPlan {
  const actions = new Set<RevisionAction>();
  if (!me) return { actions, nextStep: '' };
  const state = WORKFLOW[r.status];
  if (!state.turn) {
    const mayStart = createAppAbility(defineRulesFor(me)).can('create', 'Calc');
    if (isLatest && state.allowsNextRevision && mayStart) actions.add('new-revision');
    return { actions, nextStep: state.screenNote ?? `This revision is ${state.label.toLowerCase()}.` };
  }
  const turn = state.turn;
  const refusal = turnRefusal(turn, r, me);
  if (refusal !== null) return { actions, nextStep: refusal };
  if (turn.may.includes('update')) actions.add('edit').add('withdraw');
  if (turn.may.includes('return')) actions.add('raise-finding').add('return');
  const hiding = signingBlockers(turn.signs, signingContextOf(r, me), 'content').find((b) => b.blocker.hidesAction);
  if (!hiding) actions.add(SIGN_BUTTON[turn.signs]);
  return { actions, nextStep: hiding ? `${hiding.message}.` : READY[turn.signs] };
}

/** Why this person does not hold the revision's turn, in screen words; null when they do. */
function turnRefusal(turn: Turn, r: RevisionDto, me: SessionUser): string | null {
  const parties = partiesOfRevision(r);
  const holdsRole = (me.roles as string[]).includes(turn.role);
  if (holdsRole && RELATION[turn.relation].holds(me.id, parties)) return null;
  const waiting =
    turn.relation === 'own' ? `With its author, ${r.author.name}.` : `Waiting for ${WAITING[turn.signs]}.`;
  // Its checker is told who is awaited, whether or not they also hold the role that signs next.
  if (turn.relation === 'independent-of-checker' && me.id === parties.checkerId) {
    return `Waiting for ${WAITING[turn.signs]} by someone other than its checker.`;
  }
  if (!holdsRole || turn.relation === 'own') return waiting;
  return `${waiting} You edited this calc, so you cannot ${VERB[turn.signs]} it.`;
}

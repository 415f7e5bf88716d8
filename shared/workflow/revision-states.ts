import type { Role } from '../authz/roles';
import type { Relation } from './relations';

/**
 * The sign-off workflow, defined once. Each state says who holds the revision (role, how they
 * stand to it, what they may do), what a signature there means, how screens and reports show it,
 * and which dashboard queue lists it. CASL rules, signing checks, queues, report marks, badges and
 * the client's buttons are all read from here; a new state is a row here plus a migration
 * (the `status` ENUM and the summary trigger's `latest_since`) and its tests.
 */
export const REVISION_STATES = [
  'draft',
  'in_check',
  'returned',
  'checked',
  'approved',
  'superseded',
  'withdrawn',
] as const;
export type RevisionState = (typeof REVISION_STATES)[number];

export const MEANINGS = ['authored', 'checked', 'approved'] as const;
/** What a signature says; the state it moves to and what it stamps are in SIGNATURES (signatures.ts). */
export type Meaning = (typeof MEANINGS)[number];

/** The CASL actions a revision's holder is given while it is in their hands. */
export type WorkflowAction = 'update' | 'submit' | 'check' | 'approve' | 'return' | 'sign';

export interface Turn {
  role: Role;
  relation: Relation;
  may: readonly WorkflowAction[];
  /** The meaning of a signature made in this state. */
  signs: Meaning;
}

/** pass/warn/fail colour of the report's state box and mark; the badge picks one of a few screen tones. */
export type Tone = 'pass' | 'warn' | 'fail';
export type BadgeTone = 'open' | 'waiting' | 'returned' | 'checked' | 'released' | 'closed';

export interface StateSpec {
  label: string;
  badge: { glyph: string; tone: BadgeTone };
  /** `mark` runs across every report page; only a released revision has none. */
  report: { tone: Tone; mark: string | null };
  /** The author may change content and files. */
  isEditable: boolean;
  /** Who acts next; null once the revision is a closed record (its files are read-only too). */
  turn: Turn | null;
  /** A calc whose newest revision is in this state may start its next revision. */
  allowsNextRevision: boolean;
  /** What the revision page says once nobody acts on it (otherwise "This revision is <label>."). */
  screenNote?: string;
}

const AUTHOR_TURN: Turn = { role: 'author', relation: 'own', may: ['update', 'submit', 'sign'], signs: 'authored' };
const CHECKER_TURN: Turn = {
  role: 'checker',
  relation: 'independent',
  may: ['check', 'return', 'sign'],
  signs: 'checked',
};
const APPROVER_TURN: Turn = {
  role: 'approver',
  relation: 'independent-of-checker',
  may: ['approve', 'return', 'sign'],
  signs: 'approved',
};

type Shown = Pick<StateSpec, 'label' | 'badge'>;

/** The author holds it: content and files change, and every report page says it is a draft. */
function heldByAuthor(shown: Shown): StateSpec {
  const report: StateSpec['report'] = { tone: 'fail', mark: 'DRAFT · NOT FOR CONSTRUCTION' };
  return { ...shown, report, isEditable: true, turn: AUTHOR_TURN, allowsNextRevision: false };
}

/** A reviewer holds it: the content is frozen for their signature and not yet fit to build from. */
function underReview(shown: Shown, stage: string, turn: Turn): StateSpec {
  const report: StateSpec['report'] = { tone: 'warn', mark: `${stage} · NOT FOR CONSTRUCTION` };
  return { ...shown, report, isEditable: false, allowsNextRevision: false, turn };
}

/** Nobody acts on it any more: a read-only record, files included. */
function closedRecord(spec: Omit<StateSpec, 'isEditable' | 'turn'>): StateSpec {
  return { ...spec, isEditable: false, turn: null };
}

export const WORKFLOW: Record<RevisionState, StateSpec> = {
  draft: heldByAuthor({ label: 'Draft', badge: { glyph: '✎', tone: 'open' } }),
  in_check: underReview({ label: 'In check', badge: { glyph: '◔', tone: 'waiting' } }, 'IN CHECK', CHECKER_TURN),
  returned: heldByAuthor({ label: 'Returned', badge: { glyph: '↩', tone: 'returned' } }),
  checked: underReview(
    { label: 'Checked', badge: { glyph: '◑', tone: 'checked' } },
    'AWAITING APPROVAL',
    APPROVER_TURN,
  ),
  approved: closedRecord({
    label: 'Approved',
    badge: { glyph: '●', tone: 'released' },
    report: { tone: 'pass', mark: null },
    allowsNextRevision: true,
    screenNote: 'Released. Approved revisions are read-only; a change needs a new revision with a reason.',
  }),
  superseded: closedRecord({
    label: 'Superseded',
    badge: { glyph: '○', tone: 'closed' },
    report: { tone: 'fail', mark: 'SUPERSEDED · DO NOT USE' },
    allowsNextRevision: false,
  }),
  withdrawn: closedRecord({
    label: 'Withdrawn',
    badge: { glyph: '×', tone: 'closed' },
    report: { tone: 'fail', mark: 'WITHDRAWN · DO NOT USE' },
    allowsNextRevision: true,
  }),
};

/**
 * The dashboard queues, in the order the dashboard shows them: each lists the calcs whose newest revision waits in
 * `state`.
 */
export const QUEUES = [
  { key: 'my-drafts', state: 'draft', label: 'My drafts' },
  { key: 'returned-to-me', state: 'returned', label: 'Returned to me' },
  { key: 'awaiting-my-check', state: 'in_check', label: 'Waiting for my check' },
  { key: 'awaiting-my-approval', state: 'checked', label: 'Waiting for my approval' },
] as const satisfies readonly { key: string; state: RevisionState; label: string }[];

/** Moves that are not signatures. */
export const RETURNED_STATE: RevisionState = 'returned';
export const WITHDRAWN_STATE: RevisionState = 'withdrawn';
/** An approved revision becomes this when a newer revision of the same calc is approved. */
export const SUPERSEDED_STATE: RevisionState = 'superseded';

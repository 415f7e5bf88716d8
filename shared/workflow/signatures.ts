import type { Role } from '../authz/roles';
import { REVISION_STATES, WORKFLOW, type Meaning, type RevisionState } from './revision-states';

/** The timestamp and person columns a signature fills in on its revision. */
export type StampColumn = 'submittedAt' | 'checkedAt' | 'approvedAt';
export type SignerColumn = 'checkerId' | 'approverId';

export interface SignatureSpec {
  /** The state the revision moves to once signed. */
  to: RevisionState;
  /** The hand-over mail it sends. */
  event: 'submitted' | 'checked' | 'approved';
  stamp: { at: StampColumn; by?: SignerColumn };
  /** Signing supersedes every earlier revision of the calc that is in `to`. */
  supersedesOlder: boolean;
}

export const SIGNATURES: Record<Meaning, SignatureSpec> = {
  authored: { to: 'in_check', event: 'submitted', stamp: { at: 'submittedAt' }, supersedesOlder: false },
  checked: { to: 'checked', event: 'checked', stamp: { at: 'checkedAt', by: 'checkerId' }, supersedesOlder: false },
  approved: { to: 'approved', event: 'approved', stamp: { at: 'approvedAt', by: 'approverId' }, supersedesOlder: true },
};

/** States in which a signature carries this meaning. */
export const statesSignedAs = (meaning: Meaning): RevisionState[] =>
  REVISION_STATES.filter((s) => WORKFLOW[s].turn?.signs === meaning);

/** The role that signs with this meaning (the holder of the states it is made in). */
export function roleFor(meaning: Meaning): Role {
  const state = statesSignedAs(meaning)[0];
  return WORKFLOW[state].turn!.role;
}

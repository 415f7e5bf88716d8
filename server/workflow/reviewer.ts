import type { Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import type { Actor } from '../audit/audit.service';
import { assertCan, editorIdsOf, loadRevisionForChange } from '../calcs/calc-access';

/** A checker or approver acting on a revision. */
export type Reviewer = Actor & { id: number };

/** Nobody reviews a calc they authored or edited: 403 in words, whatever their roles. */
export async function assertIndependentReviewer(actor: Reviewer, calcId: number, authorId: number): Promise<void> {
  if (actor.id === authorId || (await editorIdsOf(calcId)).includes(actor.id)) {
    throw new AppError(
      'forbidden',
      403,
      'You edited this calc, so you cannot review it; independence requires someone else',
    );
  }
}

/**
 * The revision a reviewer is about to act on (raise or close a finding, return it), locked for the transaction,
 * once the ability allows a return and the reviewer is independent of it. `refusal` is the 403 message when the
 * ability does not allow it, worded for the step the reviewer tried.
 */
export async function loadRevisionForReview(
  ability: AppAbility,
  actor: Reviewer,
  revisionId: number,
  refusal: string,
  transaction: Transaction,
): Promise<Revision> {
  const revision = await loadRevisionForChange(revisionId, transaction);
  assertCan(ability, 'return', revision, refusal);
  await assertIndependentReviewer(actor, revision.calcId, revision.authorId);
  return revision;
}

import { AppError } from '../errors/app-error';
import type { Actor } from '../audit/audit.service';
import { editorIdsOf } from '../calcs/calc-access';

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

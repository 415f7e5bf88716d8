import type { Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import { IndependentModel, User, type Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { assertCan, editorIdsOf } from '../calcs/calc-access';
import { needOf } from './blind';

type Checker = { id: number };

/**
 * Who may build or lock the model of this revision: an independent checker while it is in check,
 * under a standard that asks for a model, and only the checker who started it. A locked model is
 * never changed again, by anyone.
 */
export async function assertModelWriter(
  ability: AppAbility,
  actor: Checker,
  revision: Revision,
  model: IndependentModel | null,
  transaction: Transaction,
): Promise<void> {
  const need = needOf(revision);
  if (need.method !== 'independent-model') {
    throw AppError.conflict(`${need.reason}; this revision needs no independent model`);
  }
  assertCan(
    ability,
    'check',
    revision,
    'Only an independent checker builds the independent model, while the revision is in check',
  );
  if (actor.id === revision.authorId || (await editorIdsOf(revision.calcId, transaction)).includes(actor.id)) {
    throw new Error403(
      'You edited this calc, so you cannot build its independent model; independence requires someone else',
    );
  }
  if (model && model.checkerId !== actor.id) {
    const owner = await User.findByPk(model.checkerId, { attributes: ['displayName'], transaction });
    throw new Error403(
      `${owner?.displayName ?? 'Another checker'} is building the independent model of this revision; only they can change or lock it`,
    );
  }
  if (model?.lockedAt)
    throw AppError.conflict(
      'The independent model is locked; nobody can change it. A new revision starts a new comparison',
    );
}

class Error403 extends AppError {
  constructor(message: string) {
    super('forbidden', 403, message);
  }
}

/**
 * Reading the model: its checker at any time; anyone else who reads the revision once it is locked and they are not
 * blind.
 */
export function assertModelReader(viewerId: number | null, blind: boolean, model: IndependentModel): void {
  if (model.checkerId === viewerId) return;
  if (!model.lockedAt)
    throw new Error403("The checker's independent model is shown once they lock it; until then it is theirs alone");
  if (blind)
    throw new Error403("Build and lock your own independent model first; the comparison shows the author's values");
}

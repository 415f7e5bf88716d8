import type { Transaction } from 'sequelize';
import type { SignedModel } from '../../shared/schemas/independent-model.schema';
import { IndependentModel, User } from '../db/models';
import { signedModelOf } from './model-hash';

/**
 * Content format 3 adds the locked independent model (its input, hash and the comparison) to what
 * a signature covers. A revision with a locked model is signed in format 3 from then on; an earlier
 * signature keeps its format and is judged in it, so the author's signature holds as before.
 */
export const MODEL_CONTENT_FORMAT = 3;

export async function lockedModelOf(revisionId: number, transaction?: Transaction): Promise<SignedModel | null> {
  const row = await IndependentModel.findOne({ where: { revisionId }, transaction });
  if (!row?.lockedAt) return null;
  const checker = await User.findByPk(row.checkerId, { attributes: ['id', 'displayName'], transaction });
  return signedModelOf(row, checker?.displayName ?? 'unknown', transaction);
}

/** The format a new signature of this revision is made in. */
export async function signingFormatOf(revisionId: number, base: number, transaction?: Transaction): Promise<number> {
  return (await lockedModelOf(revisionId, transaction)) ? MODEL_CONTENT_FORMAT : base;
}

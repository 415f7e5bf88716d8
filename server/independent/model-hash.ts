import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import type { Comparison } from '../../shared/verification';
import type { SignedModel } from '../../shared/schemas/independent-model.schema';
import type { Transaction } from 'sequelize';
import type { CalcResult } from '../../shared/engine';
import type { Checklist } from '../../shared/rules';
import { IndependentModel, Revision } from '../db/models';
import { expandResult } from '../calcs/stored-result';
import { expandChecklist } from '../calcs/stored-checklist';

const sha256 = (value: unknown) =>
  createHash('sha256')
    .update(canonicalize(value) ?? '')
    .digest('hex');

type StoredModel = Pick<IndependentModel, 'input' | 'result' | 'checklist'>;

/**
 * The checker's input, and the result and checklist as the engine and evaluator returned them: stored compactly
 * like a revision's (server/calcs/stored-result.ts, stored-checklist.ts), or whole in rows saved before that.
 */
export async function modelContentOf(row: StoredModel, transaction?: Transaction) {
  return {
    input: JSON.parse(row.input) as Record<string, unknown>,
    result: (await expandResult(IndependentModel.sequelize!, row.result, transaction)) as CalcResult | null,
    checklist: expandChecklist(row.checklist) as Checklist | null,
  };
}

/**
 * SHA-256 over the RFC 8785 JSON of the checker's input, result and checklist as the engine and evaluator
 * returned them (read back from the stored form), so a compactly stored model hashes as one stored whole.
 */
export async function modelHashOf(row: StoredModel, transaction?: Transaction): Promise<string> {
  return sha256(await modelContentOf(row, transaction));
}

/**
 * The part of a locked model a signature covers (content format 3), rebuilt from what is stored
 * now: a changed input, result or comparison changes the hash, so tampering shows as a broken signature.
 */
export async function signedModelOf(
  row: IndependentModel,
  checkerName: string,
  transaction?: Transaction,
): Promise<SignedModel | null> {
  if (!row.lockedAt || !row.comparison || !row.authorHash) return null;
  return {
    checker: checkerName,
    lockedAt: row.lockedAt.toISOString(),
    input: JSON.parse(row.input),
    modelHash: await modelHashOf(row, transaction),
    authorHash: row.authorHash,
    agrees: row.agrees === true,
    comparison: JSON.parse(row.comparison) as Comparison,
  };
}

/**
 * The author's model as the comparison saw it: input, result (units and formulas put back) and
 * checklist, without the attachment set, so evidence added later never makes a comparison stale.
 */
export async function authorModelHash(revision: Revision, transaction?: Transaction): Promise<string | null> {
  if (!revision.result || !revision.checklist) return null;
  const result = await expandResult(Revision.sequelize!, revision.result, transaction);
  return sha256({ input: JSON.parse(revision.input), result, checklist: expandChecklist(revision.checklist) });
}

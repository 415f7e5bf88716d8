import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import type { Comparison } from '../../shared/verification';
import type { SignedModel } from '../../shared/schemas/independent-model.schema';
import type { Transaction } from 'sequelize';
import { Revision, type IndependentModel } from '../db/models';
import { expandResult } from '../calcs/stored-result';
import { expandChecklist } from '../calcs/stored-checklist';

const sha256 = (value: unknown) =>
  createHash('sha256')
    .update(canonicalize(value) ?? '')
    .digest('hex');

/** SHA-256 over the RFC 8785 JSON of the checker's input, result and checklist as stored. */
export function modelHashOf(row: Pick<IndependentModel, 'input' | 'result' | 'checklist'>): string {
  return sha256({
    input: JSON.parse(row.input),
    result: row.result ? JSON.parse(row.result) : null,
    checklist: row.checklist ? JSON.parse(row.checklist) : null,
  });
}

/**
 * The part of a locked model a signature covers (content format 3), rebuilt from what is stored
 * now: a changed input, result or comparison changes the hash, so tampering shows as a broken signature.
 */
export function signedModelOf(row: IndependentModel, checkerName: string): SignedModel | null {
  if (!row.lockedAt || !row.comparison || !row.authorHash) return null;
  return {
    checker: checkerName,
    lockedAt: row.lockedAt.toISOString(),
    input: JSON.parse(row.input),
    modelHash: modelHashOf(row),
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

import type { Transaction } from 'sequelize';
import type { VerificationNeed } from '../../shared/verification';
import { Finding, IndependentModel, User, type Revision } from '../db/models';
import { needOf } from './blind';
import { authorModelHash } from './model-hash';

export interface ModelBlockerContext {
  need: VerificationNeed;
  signerId: number;
  model: {
    checkerId: number;
    checkerName: string;
    locked: boolean;
    agrees: boolean | null;
    authorHash: string | null;
  } | null;
  /** The author's model hash now: a comparison made against another input or result is stale. */
  authorHashNow: string | null;
  /** Findings raised for the comparison's differences that are not closed yet. */
  unclosedDifferences: number;
}

/**
 * Why this signature as checked must wait for the independent model, or null. Self-contained so
 * the workflow table can call it wherever signing blockers end up; approval follows a check that
 * already passed it.
 */
export function independentModelBlocker(meaning: string, c: ModelBlockerContext): string | null {
  if (meaning !== 'checked' || c.need.method !== 'independent-model') return null;
  if (!c.model) return `${c.need.reason}. Build and lock your independent model before signing as checked`;
  if (c.model.checkerId !== c.signerId)
    return `${c.model.checkerName} built the independent model of this revision; only they can sign it as checked`;
  if (!c.model.locked)
    return "Lock your independent model first: signing as checked needs the comparison with the author's calc";
  if (c.model.authorHash !== c.authorHashNow)
    return "The author's calc changed after your comparison; compare again before signing";
  if (!c.model.agrees && c.unclosedDifferences > 0)
    return c.unclosedDifferences === 1
      ? 'A difference between the two models has a finding that is not closed'
      : `${c.unclosedDifferences} differences between the two models have findings that are not closed`;
  return null;
}

/** Gathers the context above for one revision (under the signing transaction). */
export async function independentModelBlockerFor(
  meaning: string,
  signerId: number,
  revision: Revision,
  transaction?: Transaction,
): Promise<string | null> {
  if (meaning !== 'checked') return null;
  const need = needOf(revision);
  if (need.method !== 'independent-model') return null;
  const row = await IndependentModel.findOne({ where: { revisionId: revision.id }, transaction });
  const ids = row?.findingIds ? (JSON.parse(row.findingIds) as number[]) : [];
  const unclosed = ids.length
    ? (await Finding.findAll({ where: { id: ids }, transaction })).filter((f) => f.status !== 'closed').length
    : 0;
  const checkerName = row
    ? ((await User.findByPk(row.checkerId, { attributes: ['displayName'], transaction }))?.displayName ??
      'Another checker')
    : '';
  return independentModelBlocker(meaning, {
    need,
    signerId,
    model: row
      ? {
          checkerId: row.checkerId,
          checkerName,
          locked: row.lockedAt !== null,
          agrees: row.agrees,
          authorHash: row.authorHash,
        }
      : null,
    authorHashNow: row?.lockedAt ? await authorModelHash(revision, transaction) : null,
    unclosedDifferences: unclosed,
  });
}

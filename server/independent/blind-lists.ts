import { LRUCache } from 'lru-cache';
import { Op, type Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import { IndependentModel, RuleSetRecord, type Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { parseRuleSet } from '../rule-sets/rule-set-cache';
import { BLIND_STATES, isBlind, modelOfRevision, needOf } from './blind';
import { viewerOf } from './viewer';

export interface ListedRevision {
  revisionId: number;
  ruleSetId: number;
  authorId: number;
  status: string;
  /**
   * What the list's own statement already read, so no further statement is needed: the lock version of the row's
   * standard and whether the reader's own independent model of it is locked.
   */
  known?: { ruleSetVersion: number; ownModelLocked: boolean };
}

/**
 * Lists show each calc's verdict; for a blind checker that is the author's result. Lists do not
 * read inputs, so a standard that asks for a model above a duty level counts as asking for one
 * here: the verdict is hidden from a possible checker until their own model is locked (on the
 * safe side; the revision page applies the exact rule).
 */
export async function blindRevisionIds(ability: AppAbility, rows: readonly ListedRevision[]): Promise<Set<number>> {
  const viewer = viewerOf(ability);
  const candidates = rows.filter((r) => viewer.mayCheck && r.authorId !== viewer.id && BLIND_STATES.includes(r.status));
  if (!candidates.length) return new Set();
  if (candidates.every((r) => r.known)) {
    const asking = await askingAt(candidates.map((r) => ({ id: r.ruleSetId, lockVersion: r.known!.ruleSetVersion })));
    return new Set(
      candidates.filter((r) => asking.has(r.ruleSetId) && !r.known!.ownModelLocked).map((r) => r.revisionId),
    );
  }
  const asking = await askingForModels([...new Set(candidates.map((r) => r.ruleSetId))]);
  const inScope = candidates.filter((r) => asking.has(r.ruleSetId));
  if (!inScope.length) return new Set();
  const own = await IndependentModel.findAll({
    where: { revisionId: inScope.map((r) => r.revisionId), checkerId: viewer.id ?? 0, lockedAt: { [Op.ne]: null } },
    attributes: ['revisionId'],
  });
  const done = new Set(own.map((m) => m.revisionId));
  return new Set(inScope.filter((r) => !done.has(r.revisionId)).map((r) => r.revisionId));
}

// Whether a standard asks for an independent model, by id and lock version (a document never changes under one).
const asksByVersion = new LRUCache<string, boolean>({ max: 1_000 });

/**
 * The standards among these that ask for an independent model. Their versions are read every time; a document
 * only when this process has not judged that version yet.
 */
async function askingForModels(ids: number[]): Promise<Set<number>> {
  return askingAt(await RuleSetRecord.findAll({ where: { id: ids }, attributes: ['id', 'lockVersion'], raw: true }));
}

/** The standards among these versions that ask for an independent model; a document is read only for a new version. */
async function askingAt(listed: { id: number; lockVersion: number }[]): Promise<Set<number>> {
  const keyOf = (r: { id: number; lockVersion: number }) => `${r.id}:${r.lockVersion}`;
  const versions = [...new Map(listed.map((r) => [keyOf(r), r])).values()];
  const asking = new Set(versions.filter((r) => asksByVersion.get(keyOf(r))).map((r) => r.id));
  const unknown = versions.filter((r) => !asksByVersion.has(keyOf(r))).map((r) => r.id);
  if (!unknown.length) return asking;
  // Judged from the document as read now, whatever version it has reached since.
  const records = await RuleSetRecord.findAll({
    where: { id: unknown },
    attributes: ['id', 'lockVersion', 'document'],
  });
  for (const r of records) {
    const asks = Boolean(parseRuleSet(r).verification);
    asksByVersion.set(keyOf(r), asks);
    if (asks) asking.add(r.id);
  }
  return asking;
}

/** Hides the verdict of each listed revision the reader must not see yet. */
export async function hideBlindVerdicts<T extends { verdict: string | null }>(
  ability: AppAbility,
  items: T[],
  listed: (item: T) => ListedRevision,
): Promise<T[]> {
  const blind = await blindRevisionIds(ability, items.map(listed));
  return blind.size ? items.map((i) => (blind.has(listed(i).revisionId) ? { ...i, verdict: null } : i)) : items;
}

export function blindError(): AppError {
  return new AppError(
    'forbidden',
    403,
    "Build and lock your independent model first: until then the author's numbers stay hidden from you",
  );
}

/**
 * Manual items wait for the lock: each one compares the author's calc with a source document (the material
 * certificate's grade with the calc material, the load cases with the duty specification), so a blind tick would
 * vouch for values the checker has not seen, and its stored state would show the author's side of the check.
 */
export async function assertNotBlind(ability: AppAbility, revision: Revision, transaction: Transaction): Promise<void> {
  const model = await modelOfRevision(revision.id, transaction);
  if (!isBlind(viewerOf(ability), revision, needOf(revision), model)) return;
  throw new AppError(
    'forbidden',
    403,
    "Lock your independent model first: the manual items compare the author's calc with its documents, which you see after the lock",
  );
}

import type { Transaction } from 'sequelize';
import { LRUCache } from 'lru-cache';
import type { RuleSet } from '../../shared/rules';
import { RuleSetRecord } from '../db/models';
import { AppError } from '../errors/app-error';

// Parsed documents by id and lock version: effective versions never change, drafts bump the version.
// Bounded: every draft save makes a new key, and the superseded ones are never asked for again.
const cache = new LRUCache<string, RuleSet>({ max: 200 });

/** What a revision shows and hashes of its standard (the columns a revision read joins). */
export const REVISION_RULE_SET_ATTRIBUTES = [
  'id',
  'code',
  'version',
  'title',
  'contentHash',
  'document',
  'lockVersion',
];

/**
 * The standard's row as a revision read joins it, by id, lock version and content hash. Every change to a row through
 * the app bumps its lock version (Sequelize's optimistic locking: a draft's save, its proposal and confirmation, and
 * an effective version's retirement), so a row whose stamp matches is the row as stored. The stamp is read with
 * the revision (a save reads it in its context statement), the ~15 kB document is not.
 */
const records = new LRUCache<string, RuleSetRecord>({ max: 200 });

export interface RuleSetStamp {
  id: number;
  lockVersion: number;
  contentHash: string;
}

const stampKey = (s: RuleSetStamp) => `${s.id}:${s.lockVersion}:${s.contentHash}`;

/** The joined row for `stamp`: remembered, or read (and remembered when the read finds the same stamp). */
export async function revisionRuleSet(stamp: RuleSetStamp, transaction?: Transaction): Promise<RuleSetRecord | null> {
  const known = records.get(stampKey(stamp));
  if (known) return known;
  const record = await RuleSetRecord.findByPk(stamp.id, { attributes: REVISION_RULE_SET_ATTRIBUTES, transaction });
  if (record) records.set(stampKey(record), record);
  return record;
}

export function parseRuleSet(record: RuleSetRecord): RuleSet {
  const key = `${record.id}:${record.lockVersion}`;
  let doc = cache.get(key);
  if (!doc) {
    doc = JSON.parse(record.document) as RuleSet;
    cache.set(key, doc);
  }
  return doc;
}

export async function loadRuleSet(
  id: number,
  transaction?: Transaction,
): Promise<{ record: RuleSetRecord; doc: RuleSet }> {
  const record = await RuleSetRecord.findByPk(id, { transaction });
  if (!record)
    throw new AppError('validation', 400, `Design standard ${id} does not exist`, {
      fieldErrors: { ruleSetId: ['does not exist'] },
    });
  return { record, doc: parseRuleSet(record) };
}

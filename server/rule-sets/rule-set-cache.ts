import type { Transaction } from 'sequelize';
import { LRUCache } from 'lru-cache';
import type { RuleSet } from '../../shared/rules';
import { RuleSetRecord } from '../db/models';
import { AppError } from '../errors/app-error';

// Parsed documents by id and lock version: effective versions never change, drafts bump the version.
// Bounded: every draft save makes a new key, and the superseded ones are never asked for again.
const cache = new LRUCache<string, RuleSet>({ max: 200 });

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

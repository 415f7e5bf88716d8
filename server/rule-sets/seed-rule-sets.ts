import fs from 'node:fs';
import path from 'node:path';
import { Op, type Sequelize, type Transaction } from 'sequelize';
import { validateRuleSet } from '../../shared/rules';
import { RuleSetRecord } from '../db/models';
import { appendAudit } from '../audit/audit.service';
import { documentHash } from './rule-set-mapping';

const RULES_DIR = path.resolve(__dirname, '../../rules');

async function retireEarlier(
  sequelize: Sequelize,
  id: number,
  code: string,
  version: number,
  transaction: Transaction,
): Promise<void> {
  const earlier = await RuleSetRecord.findAll({
    where: { code, status: 'effective', version: { [Op.lt]: version } },
    transaction,
  });
  for (const r of earlier) {
    await r.update({ status: 'retired' }, { transaction });
    await appendAudit(
      sequelize,
      { id: null, name: 'standards loader', ip: null },
      {
        action: 'rule_set.retired',
        entityType: 'RuleSet',
        entityId: r.id,
        payload: { code, version: r.version, supersededBy: version, by: id },
      },
      transaction,
    );
  }
}

/**
 * Loads the design standards shipped in rules/ into the database, once per code and version.
 * Runs on every start, so a standard added to the repository appears without a migration;
 * versions already in the database are never touched (they may have been confirmed since), except
 * that a newly shipped effective version retires the code's earlier effective ones, as confirming
 * a version does: one version of a standard is effective at a time, and calcs keep their own.
 */
export async function seedRuleSets(sequelize: Sequelize): Promise<number> {
  let added = 0;
  for (const file of fs
    .readdirSync(RULES_DIR)
    .filter((f) => f.endsWith('.json'))
    .sort()) {
    const raw = JSON.parse(fs.readFileSync(path.join(RULES_DIR, file), 'utf8'));
    const { $schema: _ignored, ...doc } = raw;
    const checked = validateRuleSet(doc);
    if (!checked.ok)
      throw new Error(
        `rules/${file} is not a valid design standard: ${checked.issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`,
      );
    const v = checked.value;
    if (await RuleSetRecord.findOne({ where: { code: v.code, version: v.version } })) continue;
    await sequelize.transaction(async (transaction) => {
      const record = await RuleSetRecord.create(
        {
          code: v.code,
          version: v.version,
          title: v.title,
          status: v.status,
          effectiveDate: v.effectiveDate ?? null,
          document: JSON.stringify(v),
          contentHash: documentHash(v),
          createdBy: null,
        },
        { transaction },
      );
      if (v.status === 'effective') await retireEarlier(sequelize, record.id, v.code, v.version, transaction);
      await appendAudit(
        sequelize,
        { id: null, name: 'standards loader', ip: null },
        {
          action: 'rule_set.loaded',
          entityType: 'RuleSet',
          entityId: record.id,
          payload: { code: v.code, version: v.version, status: v.status, file },
        },
        transaction,
      );
    });
    added++;
  }
  return added;
}

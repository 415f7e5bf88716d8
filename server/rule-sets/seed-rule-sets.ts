import fs from 'node:fs';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import { validateRuleSet } from '../../shared/rules';
import { RuleSetRecord } from '../db/models';
import { appendAudit } from '../audit/audit.service';
import { documentHash } from './rule-set-mapping';

const RULES_DIR = path.resolve(__dirname, '../../rules');

/**
 * Loads the design standards shipped in rules/ into the database, once per code and version.
 * Runs on every start, so a standard added to the repository appears without a migration;
 * versions already in the database are never touched (they may have been confirmed since).
 */
export async function seedRuleSets(sequelize: Sequelize): Promise<number> {
  let added = 0;
  for (const file of fs.readdirSync(RULES_DIR).filter((f) => f.endsWith('.json')).sort()) {
    const raw = JSON.parse(fs.readFileSync(path.join(RULES_DIR, file), 'utf8'));
    const { $schema: _ignored, ...doc } = raw;
    const checked = validateRuleSet(doc);
    if (!checked.ok) throw new Error(`rules/${file} is not a valid design standard: ${checked.issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`);
    const v = checked.value;
    if (await RuleSetRecord.findOne({ where: { code: v.code, version: v.version } })) continue;
    await sequelize.transaction(async (transaction) => {
      const record = await RuleSetRecord.create({
        code: v.code, version: v.version, title: v.title, status: v.status, effectiveDate: v.effectiveDate ?? null,
        document: JSON.stringify(v), contentHash: documentHash(v), createdBy: null,
      }, { transaction });
      await appendAudit(sequelize, { id: null, name: 'standards loader', ip: null }, {
        action: 'rule_set.loaded', entityType: 'RuleSet', entityId: record.id, payload: { code: v.code, version: v.version, status: v.status, file },
      }, transaction);
    });
    added++;
  }
  return added;
}

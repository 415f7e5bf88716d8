import { subject } from '@casl/ability';
import type { Sequelize, Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import { RuleSetRecord } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit } from '../audit/audit.service';
import { jsonDiff } from '../calcs/content-diff';
import { documentHash } from './rule-set-mapping';
import { runTransaction } from '../db/transaction';
import { plainSelect } from '../db/plain-query';
import { assertDraft, loadRuleSet, validDocument, type Person } from './rule-set-records';
import { forbiddenCheck } from '../authz/forbidden-check';

/**
 * A new version's life as a draft: compliance copies one from an existing version, saves its document, and
 * proposes it with an effective date. Each step is one audited transaction.
 */
export class RuleSetDrafts {
  constructor(private readonly sequelize: Sequelize) {}

  /** A draft copied from version `fromId`, numbered after the standard's latest version; returns its id. */
  async create(ability: AppAbility, actor: Person, fromId: number): Promise<number> {
    forbiddenCheck(ability)
      .setMessage('Only compliance drafts design standards')
      .throwUnlessCan('create', subject('RuleSet', { status: 'draft' }));
    return runTransaction(this.sequelize, async (transaction) => {
      const from = await loadRuleSet(fromId, transaction);
      // Locked: a second draft of the same standard started meanwhile waits and numbers itself after this one (read
      // plainly, both took the same number and the second was refused on the unique code and version).
      const [{ latest }] = await plainSelect<{ latest: number }>(
        this.sequelize,
        'SELECT MAX(version) AS latest FROM rule_sets WHERE code = ? FOR UPDATE',
        [from.code],
        transaction,
      );
      const version = Number(latest) + 1;
      const record = await insertDraft(from, version, actor, transaction);
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'rule_set.drafted',
          entityType: 'RuleSet',
          entityId: record.id,
          payload: { code: from.code, version, from: from.version },
        },
        transaction,
      );
      return record.id;
    });
  }

  async save(
    ability: AppAbility,
    actor: Person,
    id: number,
    document: Record<string, unknown>,
    lockVersion: number,
  ): Promise<void> {
    await runTransaction(this.sequelize, async (transaction) => {
      const record = await loadRuleSet(id, transaction, true);
      assertDraft(ability, record, 'update');
      if (record.lockVersion !== lockVersion)
        throw AppError.conflict('Someone else saved this draft since you opened it; reload to see their version');
      // Identity fields belong to the record, not to what the editor sends.
      const checked = validDocument({ ...document, code: record.code, version: record.version, status: 'draft' });
      const label = `${record.code} v${record.version}`;
      const diff = jsonDiff(JSON.parse(record.document), checked, `${label} (saved)`, `${label} (new)`);
      record.set({
        document: JSON.stringify(checked),
        title: String(checked.title),
        contentHash: documentHash(checked),
        proposedBy: null,
        effectiveDate: null,
      });
      await record.save({ transaction });
      const payload = { code: record.code, version: record.version };
      await appendAudit(
        this.sequelize,
        actor,
        { action: 'rule_set.saved', entityType: 'RuleSet', entityId: id, payload, diff },
        transaction,
      );
    });
  }

  async propose(
    ability: AppAbility,
    actor: Person,
    id: number,
    effectiveDate: string,
    lockVersion: number,
  ): Promise<void> {
    await runTransaction(this.sequelize, async (transaction) => {
      const record = await loadRuleSet(id, transaction, true);
      assertDraft(ability, record, 'publish');
      if (record.lockVersion !== lockVersion)
        throw AppError.conflict('The draft changed since you opened it; review it again');
      // Only a complete, valid document can be proposed (a fresh draft still lacks its change summary).
      validDocument(JSON.parse(record.document));
      record.set({ proposedBy: actor.id, effectiveDate });
      await record.save({ transaction });
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'rule_set.proposed',
          entityType: 'RuleSet',
          entityId: id,
          payload: { code: record.code, version: record.version, effectiveDate },
        },
        transaction,
      );
    });
  }
}

/** The draft row: the source version's document with the new number, no effective date and no change summary. */
async function insertDraft(
  from: RuleSetRecord,
  version: number,
  actor: Person,
  transaction: Transaction,
): Promise<RuleSetRecord> {
  const doc = { ...JSON.parse(from.document), version, status: 'draft', effectiveDate: null, changeSummary: '' };
  return RuleSetRecord.create(
    {
      code: from.code,
      version,
      title: from.title,
      effectiveDate: null,
      document: JSON.stringify(doc),
      contentHash: documentHash(doc),
      createdBy: actor.id,
    },
    { transaction },
  );
}

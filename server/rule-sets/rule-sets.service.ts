import { ForbiddenError, subject } from '@casl/ability';
import type { Sequelize } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { RuleSetDto, RuleSetSummary } from '../../shared/schemas/rule-set.schema';
import { RuleSetRecord } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { jsonDiff } from '../calcs/content-diff';
import { documentHash, toRuleSetDto, toRuleSetSummary } from './rule-set-mapping';
import { runTransaction } from '../db/transaction';
import { assertDraft, loadRuleSet, namesOf, validDocument } from './rule-set-records';
import { RuleSetPublication } from './rule-set-publication';

type Person = Actor & { id: number };

/**
 * Design standards as controlled documents. Compliance drafts a new version, proposes it with an
 * effective date, and a second compliance user confirms it; effective and retired versions are frozen.
 */
export class RuleSetsService {
  private readonly publication: RuleSetPublication;

  /** `onEffective` hears of every version that comes into force (impact mail to compliance). */
  constructor(
    private readonly sequelize: Sequelize,
    onEffective?: (actor: Actor, id: number) => Promise<void>,
  ) {
    this.publication = new RuleSetPublication(sequelize, onEffective);
  }

  async list(ability: AppAbility): Promise<RuleSetSummary[]> {
    ForbiddenError.from(ability).throwUnlessCan('read', 'RuleSet');
    await this.promoteDue();
    // The library lists versions; their documents (tens of kilobytes each) are read one at a time when opened.
    const rows = await RuleSetRecord.findAll({
      attributes: { exclude: ['document'] },
      order: [
        ['code', 'ASC'],
        ['version', 'DESC'],
      ],
    });
    const names = await namesOf(rows.flatMap((r) => [r.proposedBy, r.confirmedBy]));
    return rows.map((r) => toRuleSetSummary(r, names));
  }

  async get(ability: AppAbility, id: number): Promise<RuleSetDto> {
    ForbiddenError.from(ability).throwUnlessCan('read', 'RuleSet');
    const record = await loadRuleSet(id);
    return toRuleSetDto(record, await namesOf([record.proposedBy, record.confirmedBy]));
  }

  async createDraft(ability: AppAbility, actor: Person, fromId: number): Promise<RuleSetDto> {
    ForbiddenError.from(ability)
      .setMessage('Only compliance drafts design standards')
      .throwUnlessCan('create', subject('RuleSet', { status: 'draft' }));
    const id = await runTransaction(this.sequelize, async (transaction) => {
      const from = await loadRuleSet(fromId, transaction);
      const latest = await RuleSetRecord.max<number, RuleSetRecord>('version', {
        where: { code: from.code },
        transaction,
      });
      const doc = {
        ...JSON.parse(from.document),
        version: latest + 1,
        status: 'draft',
        effectiveDate: null,
        changeSummary: '',
      };
      const record = await RuleSetRecord.create(
        {
          code: from.code,
          version: latest + 1,
          title: from.title,
          effectiveDate: null,
          document: JSON.stringify(doc),
          contentHash: documentHash(doc),
          createdBy: actor.id,
        },
        { transaction },
      );
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'rule_set.drafted',
          entityType: 'RuleSet',
          entityId: record.id,
          payload: { code: from.code, version: latest + 1, from: from.version },
        },
        transaction,
      );
      return record.id;
    });
    return this.get(ability, id);
  }

  async updateDraft(
    ability: AppAbility,
    actor: Person,
    id: number,
    document: Record<string, unknown>,
    lockVersion: number,
  ): Promise<RuleSetDto> {
    await runTransaction(this.sequelize, async (transaction) => {
      const record = await loadRuleSet(id, transaction, true);
      assertDraft(ability, record, 'update');
      if (record.lockVersion !== lockVersion)
        throw AppError.conflict('Someone else saved this draft since you opened it; reload to see their version');
      // Identity fields belong to the record, not to what the editor sends.
      const doc = { ...document, code: record.code, version: record.version, status: 'draft' };
      const checked = { value: validDocument(doc) };
      const diff = jsonDiff(
        JSON.parse(record.document),
        checked.value,
        `${record.code} v${record.version} (saved)`,
        `${record.code} v${record.version} (new)`,
      );
      record.set({
        document: JSON.stringify(checked.value),
        title: String(checked.value.title),
        contentHash: documentHash(checked.value),
        proposedBy: null,
        effectiveDate: null,
      });
      await record.save({ transaction });
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'rule_set.saved',
          entityType: 'RuleSet',
          entityId: id,
          payload: { code: record.code, version: record.version },
          diff,
        },
        transaction,
      );
    });
    return this.get(ability, id);
  }

  async propose(
    ability: AppAbility,
    actor: Person,
    id: number,
    effectiveDate: string,
    lockVersion: number,
  ): Promise<RuleSetDto> {
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
    return this.get(ability, id);
  }

  /** The second compliance signature: a different person, with their password, makes it effective. */
  async confirm(
    ability: AppAbility,
    actor: Person,
    id: number,
    password: string,
    lockVersion: number,
  ): Promise<RuleSetDto> {
    await this.publication.confirm(ability, actor, id, password, lockVersion);
    return this.get(ability, id);
  }

  /** Puts confirmed versions whose effective date has come into force; cheap, and idempotent. */
  promoteDue(): Promise<void> {
    return this.publication.promoteDue();
  }
}

import { ForbiddenError, subject } from '@casl/ability';
import { Op, type Sequelize, type Transaction } from 'sequelize';
import { validateRuleSet } from '../../shared/rules';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { RuleSetDto, RuleSetSummary } from '../../shared/schemas/rule-set.schema';
import { RuleSetRecord, User } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { verifyPassword } from '../auth/password';
import { jsonDiff } from '../calcs/content-diff';
import { documentHash, toRuleSetDto, toRuleSetSummary } from './rule-set-mapping';
import { runTransaction } from '../db/transaction';

type Person = Actor & { id: number };

/**
 * Design standards as controlled documents. Compliance drafts a new version, proposes it with an
 * effective date, and a second compliance user confirms it; effective and retired versions are frozen.
 */
export class RuleSetsService {
  /** `onEffective` hears of every version that comes into force (impact mail to compliance). */
  constructor(
    private readonly sequelize: Sequelize,
    private readonly onEffective?: (actor: Actor, id: number) => Promise<void>,
  ) {}

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
    const record = await this.load(id);
    return toRuleSetDto(record, await namesOf([record.proposedBy, record.confirmedBy]));
  }

  async createDraft(ability: AppAbility, actor: Person, fromId: number): Promise<RuleSetDto> {
    ForbiddenError.from(ability)
      .setMessage('Only compliance drafts design standards')
      .throwUnlessCan('create', subject('RuleSet', { status: 'draft' }));
    const id = await runTransaction(this.sequelize, async (transaction) => {
      const from = await this.load(fromId, transaction);
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
      const record = await this.load(id, transaction, true);
      this.assertDraft(ability, record, 'update');
      if (record.lockVersion !== lockVersion)
        throw AppError.conflict('Someone else saved this draft since you opened it; reload to see their version');
      // Identity fields belong to the record, not to what the editor sends.
      const doc = { ...document, code: record.code, version: record.version, status: 'draft' };
      const checked = validateRuleSet(doc);
      if (!checked.ok)
        throw AppError.validation(Object.fromEntries(checked.issues.map((i) => [`document.${i.path}`, [i.message]])));
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
      const record = await this.load(id, transaction, true);
      this.assertDraft(ability, record, 'publish');
      if (record.lockVersion !== lockVersion)
        throw AppError.conflict('The draft changed since you opened it; review it again');
      // Only a complete, valid document can be proposed (a fresh draft still lacks its change summary).
      const checked = validateRuleSet(JSON.parse(record.document));
      if (!checked.ok)
        throw AppError.validation(Object.fromEntries(checked.issues.map((i) => [`document.${i.path}`, [i.message]])));
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
    const user = await User.scope('withPassword').findByPk(actor.id);
    if (!user || !(await verifyPassword(user.passwordHash, password))) {
      await appendAudit(this.sequelize, actor, {
        action: 'rule_set.confirmation_refused',
        entityType: 'RuleSet',
        entityId: id,
        payload: { reason: 'wrong password' },
      });
      throw new AppError('validation', 400, 'Password is not correct; nothing was confirmed', {
        fieldErrors: { password: ['is not correct'] },
      });
    }
    const isEffective = await runTransaction(this.sequelize, async (transaction) => {
      const record = await this.load(id, transaction, true);
      this.assertDraft(ability, record, 'publish');
      if (record.lockVersion !== lockVersion)
        throw AppError.conflict('The draft changed since you opened it; review it again');
      if (!record.proposedBy) throw AppError.conflict('Propose the version with an effective date first');
      if (record.proposedBy === actor.id)
        throw new AppError('forbidden', 403, 'A second compliance user must confirm; you proposed this version');
      record.confirmedBy = actor.id;
      await record.save({ transaction });
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'rule_set.confirmed',
          entityType: 'RuleSet',
          entityId: id,
          payload: { code: record.code, version: record.version, effectiveDate: record.effectiveDate },
        },
        transaction,
      );
      // A version confirmed for a later date waits, confirmed but not yet in force, until that day.
      if (record.effectiveDate! > todayUtc()) return false;
      await this.makeEffective(record, actor, transaction);
      return true;
    });
    if (isEffective) await this.onEffective?.(actor, id);
    return this.get(ability, id);
  }

  /** Puts confirmed versions whose effective date has come into force; cheap, and idempotent. */
  async promoteDue(): Promise<void> {
    const due = await RuleSetRecord.findAll({
      where: { status: 'draft', confirmedBy: { [Op.ne]: null }, effectiveDate: { [Op.lte]: todayUtc() } },
    });
    const clock: Actor = { id: null, name: 'effective-date clock', ip: null };
    for (const record of due) {
      const promoted = await runTransaction(this.sequelize, async (transaction) => {
        const fresh = await this.load(record.id, transaction, true);
        if (fresh.status !== 'draft') return false;
        await this.makeEffective(fresh, clock, transaction);
        return true;
      });
      if (promoted) await this.onEffective?.(clock, record.id);
    }
  }

  private async makeEffective(record: RuleSetRecord, actor: Actor, transaction: Transaction): Promise<void> {
    const previous = await RuleSetRecord.findAll({
      where: { code: record.code, status: 'effective', id: { [Op.ne]: record.id } },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    for (const p of previous) await p.update({ status: 'retired' }, { transaction });
    const doc = { ...JSON.parse(record.document), status: 'effective', effectiveDate: record.effectiveDate };
    record.set({ status: 'effective', document: JSON.stringify(doc), contentHash: documentHash(doc) });
    await record.save({ transaction });
    await appendAudit(
      this.sequelize,
      actor,
      {
        action: 'rule_set.effective',
        entityType: 'RuleSet',
        entityId: record.id,
        payload: {
          code: record.code,
          version: record.version,
          effectiveDate: record.effectiveDate,
          retired: previous.map((p) => p.version),
        },
      },
      transaction,
    );
  }

  private assertDraft(ability: AppAbility, record: RuleSetRecord, action: 'update' | 'publish'): void {
    // Who may act comes first (403); only then whether the version can still change (409).
    ForbiddenError.from(ability)
      .setMessage('Only compliance edits and publishes design standards')
      .throwUnlessCan(action, subject('RuleSet', { status: 'draft' }));
    if (record.status !== 'draft')
      throw new AppError(
        'read_only',
        409,
        `${record.code} v${record.version} is ${record.status}; it never changes again`,
      );
    if (record.confirmedBy)
      throw new AppError(
        'read_only',
        409,
        `${record.code} v${record.version} is confirmed and waits for ${record.effectiveDate}; it no longer changes`,
      );
  }

  private async load(id: number, transaction?: Transaction, lock = false): Promise<RuleSetRecord> {
    const record = await RuleSetRecord.findByPk(id, {
      transaction,
      lock: lock && transaction ? transaction.LOCK.UPDATE : undefined,
    });
    if (!record) throw AppError.notFound(`Design standard version ${id}`);
    return record;
  }
}

function todayUtc(): string {
  return new Date().toISOString().slice(0, 10);
}

async function namesOf(ids: (number | null)[]): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter((v): v is number => v != null))];
  if (wanted.length === 0) return new Map();
  const users = await User.findAll({ where: { id: { [Op.in]: wanted } }, attributes: ['id', 'displayName'] });
  return new Map(users.map((u) => [u.id, u.displayName]));
}

import { Op, type Sequelize, type Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import { RuleSetRecord, User } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { verifyPassword } from '../auth/password';
import { documentHash } from './rule-set-mapping';
import { runTransaction } from '../db/transaction';
import { assertDraft, loadRuleSet, todayUtc, type Person } from './rule-set-records';

/**
 * How a proposed version comes into force: a second compliance user confirms it with their password, and on its
 * effective date it replaces the version in force, which retires. Each step is audited in its own transaction.
 */
export class RuleSetPublication {
  /** `onEffective` hears of every version that comes into force (impact mail to compliance). */
  constructor(
    private readonly sequelize: Sequelize,
    private readonly onEffective?: (actor: Actor, id: number) => Promise<void>,
  ) {}

  /** The second compliance signature: a different person, with their password, makes it effective. */
  async confirm(ability: AppAbility, actor: Person, id: number, password: string, lockVersion: number): Promise<void> {
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
      const record = await loadRuleSet(id, transaction, true);
      assertDraft(ability, record, 'publish');
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
  }

  /**
   * Puts confirmed versions whose effective date has come into force; cheap, and idempotent. `known` is every
   * version as just read (the library's list): the due ones are picked from it instead of asked for. Answers how
   * many came into force.
   */
  async promoteDue(known?: readonly RuleSetRecord[]): Promise<number> {
    // Asked on every read of the library: only the ids (each version is read whole, locked, when it is promoted).
    const due = known
      ? known.filter(isDue)
      : await RuleSetRecord.findAll({
          attributes: ['id'],
          where: { status: 'draft', confirmedBy: { [Op.ne]: null }, effectiveDate: { [Op.lte]: todayUtc() } },
        });
    const clock: Actor = { id: null, name: 'effective-date clock', ip: null };
    let promotedCount = 0;
    for (const record of due) {
      const promoted = await runTransaction(this.sequelize, async (transaction) => {
        const fresh = await loadRuleSet(record.id, transaction, true);
        if (fresh.status !== 'draft') return false;
        await this.makeEffective(fresh, clock, transaction);
        return true;
      });
      if (promoted) {
        promotedCount++;
        await this.onEffective?.(clock, record.id);
      }
    }
    return promotedCount;
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
}

/** A confirmed version whose effective date has come (the condition `promoteDue` asks the database for). */
function isDue(r: Pick<RuleSetRecord, 'status' | 'confirmedBy' | 'effectiveDate'>): boolean {
  return r.status === 'draft' && r.confirmedBy != null && r.effectiveDate != null && r.effectiveDate <= todayUtc();
}

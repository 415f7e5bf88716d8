import { subject } from '@casl/ability';
import { Op, type Transaction } from 'sequelize';
import { validateRuleSet } from '../../shared/rules';
import type { RuleSet } from '../../shared/rules/rule-set-schema';
import type { AppAbility } from '../../shared/authz/app-ability';
import { RuleSetRecord, User } from '../db/models';
import { AppError } from '../errors/app-error';
import type { Actor } from '../audit/audit.service';
import { forbiddenCheck } from '../authz/forbidden-check';

/** A signed-in compliance user acting on a design standard. */
export type Person = Actor & { id: number };

/** One design standard version, locked for the transaction's update when asked; 404 when there is none. */
export async function loadRuleSet(id: number, transaction?: Transaction, lock = false): Promise<RuleSetRecord> {
  const record = await RuleSetRecord.findByPk(id, {
    transaction,
    lock: lock && transaction ? transaction.LOCK.UPDATE : undefined,
  });
  if (!record) throw AppError.notFound(`Design standard version ${id}`);
  return record;
}

/** A version may change only while it is a draft that nobody has confirmed yet. */
export function assertDraft(ability: AppAbility, record: RuleSetRecord, action: 'update' | 'publish'): void {
  // Who may act comes first (403); only then whether the version can still change (409).
  forbiddenCheck(ability)
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

/** The document, validated; a 400 naming each field under `document.` otherwise. */
export function validDocument(doc: unknown): RuleSet {
  const checked = validateRuleSet(doc);
  if (!checked.ok)
    throw AppError.validation(Object.fromEntries(checked.issues.map((i) => [`document.${i.path}`, [i.message]])));
  return checked.value;
}

export function todayUtc(): string {
  return new Date().toISOString().slice(0, 10);
}

export async function namesOf(ids: (number | null)[]): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter((v): v is number => v != null))];
  if (wanted.length === 0) return new Map();
  const users = await User.findAll({ where: { id: { [Op.in]: wanted } }, attributes: ['id', 'displayName'] });
  return new Map(users.map((u) => [u.id, u.displayName]));
}

import { subject } from '@casl/ability';
import type { Transaction } from 'sequelize';
import type { Action, AppAbility } from '../../shared/authz/app-ability';
import { Calc, CalcEditor, Revision, RuleSetRecord, User } from '../db/models';
import { AppError } from '../errors/app-error';
import { REVISION_INCLUDE } from './calc-mapping';
import { assertProjectOpen } from '../projects/project-open';
import { forbiddenCheck } from '../authz/forbidden-check';

/** The fields ability conditions look at; the same shape the client wraps with `subject()`. */
export function revisionSubject(r: Revision) {
  return subject('Revision', {
    id: r.id,
    calcId: r.calcId,
    status: r.status,
    authorId: r.authorId,
    checkerId: r.checkerId,
    approverId: r.approverId,
  });
}

export function assertCan(ability: AppAbility, action: Action, r: Revision, message?: string): void {
  const check = forbiddenCheck(ability);
  if (message) check.setMessage(message);
  check.throwUnlessCan(action, revisionSubject(r));
}

/**
 * Loads a revision with its associations; with a transaction its row is locked for update.
 *
 * Only the revision row is locked. A locking read locks every row it reads, so the joined read
 * used for display would also lock the standard's and the people's rows, which every concurrent
 * calc creation reads (its foreign keys take shared locks on them): that crossing deadlocked.
 * Lock order for every write (DEVELOPERS.md): the calc's revision rows, then the rows the step
 * inserts, then the audit chain head last (appendAudit).
 */
export async function loadRevision(id: number, transaction?: Transaction): Promise<Revision> {
  if (!transaction) {
    const revision = await Revision.findByPk(id, { include: REVISION_INCLUDE });
    if (!revision) throw AppError.notFound(`Revision ${id}`);
    return revision;
  }
  const revision = await lockRevision(id, transaction);
  await attachAssociations(revision, transaction);
  return revision;
}

/** The revision row alone, locked for update (its standard and people are attached by the caller). */
export async function lockRevision(id: number, transaction: Transaction): Promise<Revision> {
  const revision = await Revision.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!revision) throw AppError.notFound(`Revision ${id}`);
  return revision;
}

/**
 * Loads a revision that a write is about to change (locked when a transaction is given) and
 * refuses it when its project is archived: every write starts here, so none can forget the check.
 */
export async function loadRevisionForChange(id: number, transaction?: Transaction): Promise<Revision> {
  const revision = await loadRevision(id, transaction);
  await assertProjectOpen(revision.calcId, transaction);
  return revision;
}

/** The calc-level counterpart of loadRevisionForChange, for writes that add to a calc. */
export async function loadCalcForChange(id: number, transaction: Transaction): Promise<Calc> {
  const calc = await loadCalc(id, transaction);
  await assertProjectOpen(calc.id, transaction);
  return calc;
}

/** The standard and the people of a locked revision, read without locks (they are only read). */
async function attachAssociations(revision: Revision, transaction: Transaction): Promise<void> {
  const [ruleSetInclude, ...people] = REVISION_INCLUDE;
  const ruleSet = await RuleSetRecord.findByPk(revision.ruleSetId, {
    attributes: ruleSetInclude.attributes,
    transaction,
  });
  const ids = [revision.authorId, revision.checkerId, revision.approverId].filter((v): v is number => v != null);
  const users = new Map(
    (await User.findAll({ where: { id: ids }, attributes: people[0].attributes, transaction })).map((u) => [u.id, u]),
  );
  const found = {
    ruleSet,
    author: users.get(revision.authorId) ?? null,
    checker: revision.checkerId ? (users.get(revision.checkerId) ?? null) : null,
    approver: revision.approverId ? (users.get(revision.approverId) ?? null) : null,
  };
  for (const [key, value] of Object.entries(found)) attach(revision, key, value);
}

/** Attaches what a read with REVISION_INCLUDE attaches, known already: the standard's row and the people's names. */
export function attachKnown(revision: Revision, ruleSet: RuleSetRecord | null, names: Map<number, string>): void {
  const person = (id: number | null) => {
    const name = id == null ? undefined : names.get(id);
    return name === undefined ? null : User.build({ id, displayName: name } as User, { isNewRecord: false, raw: true });
  };
  const found = {
    ruleSet,
    author: person(revision.authorId),
    checker: person(revision.checkerId),
    approver: person(revision.approverId),
  };
  for (const [key, value] of Object.entries(found)) attach(revision, key, value);
}

// The same shape an include gives: both the property and dataValues, so DTO mapping sees no difference.
function attach(revision: Revision, key: string, value: unknown): void {
  (revision.dataValues as Record<string, unknown>)[key] = value;
  (revision as unknown as Record<string, unknown>)[key] = value;
}

/** A save that switches the standard: the revision in memory carries the new one, as a reload would. */
export function attachRuleSet(revision: Revision, record: RuleSetRecord): void {
  attach(revision, 'ruleSet', record);
}

export async function loadCalc(id: number, transaction?: Transaction): Promise<Calc> {
  const calc = await Calc.findByPk(id, { transaction });
  if (!calc) throw AppError.notFound(`Calc ${id}`);
  return calc;
}

export async function editorIdsOf(calcId: number, transaction?: Transaction): Promise<number[]> {
  // In user order, as a save's context statement lists them (save-context.ts).
  const rows = await CalcEditor.findAll({ where: { calcId }, order: [['userId', 'ASC']], transaction });
  return rows.map((r) => r.userId);
}

export async function recordEditor(calcId: number, userId: number, transaction: Transaction): Promise<void> {
  await CalcEditor.findOrCreate({
    where: { calcId, userId },
    defaults: { calcId, userId, firstEditAt: new Date() },
    transaction,
  });
}

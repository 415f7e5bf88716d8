import { ForbiddenError, subject } from '@casl/ability';
import type { Transaction } from 'sequelize';
import type { Action, AppAbility } from '../../shared/authz/app-ability';
import { Calc, CalcEditor, Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { REVISION_INCLUDE } from './calc-mapping';

/** The fields ability conditions look at; the same shape the client wraps with `subject()`. */
export function revisionSubject(r: Revision) {
  return subject('Revision', { id: r.id, calcId: r.calcId, status: r.status, authorId: r.authorId, checkerId: r.checkerId, approverId: r.approverId });
}

export function assertCan(ability: AppAbility, action: Action, r: Revision, message?: string): void {
  const check = ForbiddenError.from(ability);
  if (message) check.setMessage(message);
  check.throwUnlessCan(action, revisionSubject(r));
}

/** Loads a revision with its associations; with a transaction it is locked for update. */
export async function loadRevision(id: number, transaction?: Transaction): Promise<Revision> {
  const revision = await Revision.findByPk(id, {
    include: REVISION_INCLUDE, transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined,
  });
  if (!revision) throw AppError.notFound(`Revision ${id}`);
  return revision;
}

export async function loadCalc(id: number, transaction?: Transaction): Promise<Calc> {
  const calc = await Calc.findByPk(id, { transaction });
  if (!calc) throw AppError.notFound(`Calc ${id}`);
  return calc;
}

export async function editorIdsOf(calcId: number, transaction?: Transaction): Promise<number[]> {
  const rows = await CalcEditor.findAll({ where: { calcId }, transaction });
  return rows.map((r) => r.userId);
}

export async function recordEditor(calcId: number, userId: number, transaction: Transaction): Promise<void> {
  await CalcEditor.findOrCreate({ where: { calcId, userId }, defaults: { calcId, userId, firstEditAt: new Date() }, transaction });
}

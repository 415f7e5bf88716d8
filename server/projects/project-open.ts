import type { Transaction } from 'sequelize';
import { Calc, Project } from '../db/models';
import { AppError } from '../errors/app-error';

/**
 * An archived project is a closed record: nothing in it is saved, signed, ticked, attached,
 * reviewed, returned, withdrawn or revised again. Every write to a calc checks this in its own
 * transaction. A plain read, not a locking one: archiving is rare, and a write that commits just
 * before the archive is simply earlier than it.
 */
export async function assertProjectOpen(calcId: number, transaction?: Transaction): Promise<void> {
  const calc = await Calc.findByPk(calcId, { attributes: ['id', 'projectId'], include: [{ model: Project, attributes: ['id', 'code', 'status'] }], transaction });
  const project = (calc as (Calc & { Project?: Project }) | null)?.Project;
  if (project?.status === 'archived') {
    throw new AppError('archived', 409, `Project ${project.code} is archived: its calcs are read-only. An administrator can reopen the project.`);
  }
}

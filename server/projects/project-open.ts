import type { Transaction } from 'sequelize';
import { Calc, Project } from '../db/models';
import { AppError } from '../errors/app-error';

/**
 * An archived project is a closed record: nothing in it is saved, signed, ticked, attached,
 * reviewed, returned, withdrawn or revised again. Every write to a calc checks this in its own
 * transaction. A plain read, not a locking one: archiving is rare, and a write that commits just
 * before the archive is simply earlier than it.
 */
export async function assertProjectOpen(calcId: number, transaction?: Transaction): Promise<number | undefined> {
  return assertOpen(await projectOf(calcId, transaction));
}

/** The same check on a project the caller has already read (its id, code and status). */
export function assertOpen(project: Pick<Project, 'id' | 'code' | 'status'> | undefined): number | undefined {
  if (project?.status === 'archived') {
    throw new AppError(
      'archived',
      409,
      `Project ${project.code} is archived: its calcs are read-only. An administrator can reopen the project.`,
    );
  }
  // The project's id, for a write's audit entry (its scope), so the entry needs no look-up of its own.
  return project?.id;
}

export async function isProjectArchived(calcId: number): Promise<boolean> {
  return (await projectOf(calcId))?.status === 'archived';
}

async function projectOf(calcId: number, transaction?: Transaction): Promise<Project | undefined> {
  const calc = await Calc.findByPk(calcId, {
    attributes: ['id', 'projectId'],
    include: [{ model: Project, attributes: ['id', 'code', 'status'] }],
    transaction,
  });
  return (calc as (Calc & { Project?: Project }) | null)?.Project;
}

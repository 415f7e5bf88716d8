import { literal, type Transaction } from 'sequelize';
import { Calc, Project } from '../db/models';
import { AppError } from '../errors/app-error';
import { assertOpen } from '../projects/project-open';
import type { HashSources } from './current-hash';

/** What a save reads of the calc, in one statement: its project (open?), what the hash covers, the editor list. */
export interface SaveContext {
  calc: HashSources['calc'];
  projectId: number | undefined;
  /** The saving person is already among the calc's editors (else the save adds them). */
  edited: boolean;
}

/**
 * The calc of a locked revision with its project, and whether `userId` already edited it: read once, where a save
 * used three statements (the project's status, the calc for the hash, a look-up of the editor row under a savepoint).
 * A plain read like assertProjectOpen's; the revision row's lock already orders the saves of one calc.
 */
export async function saveContextOf(calcId: number, userId: number, transaction: Transaction): Promise<SaveContext> {
  const [calcKey, userKey] = [Number(calcId), Number(userId)];
  const edited = `EXISTS(SELECT 1 FROM calc_editors e WHERE e.calc_id = ${calcKey} AND e.user_id = ${userKey})`;
  const calc = (await Calc.findByPk(calcId, {
    attributes: ['id', 'number', 'title', 'partRef', 'projectId', [literal(edited), 'edited']],
    include: [{ model: Project, attributes: ['id', 'code', 'status'] }],
    transaction,
  })) as (HashSources['calc'] & { Project?: Project }) | null;
  if (!calc) throw AppError.notFound(`Calc ${calcId}`);
  const projectId = assertOpen(calc.Project);
  return { calc, projectId, edited: Number(calc.get('edited')) === 1 };
}

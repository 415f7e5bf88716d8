import { Op, literal, type WhereOptions } from 'sequelize';
import type { AuditQuery } from '../../shared/schemas/audit.schema';
import type { AuditEvent } from '../db/models';

// Ids in these sub-queries are parsed integers (zod), never raw text, so inlining them is safe.
const revisionsOfCalc = (calcId: number) => literal(`(SELECT CAST(id AS CHAR) FROM revisions WHERE calc_id = ${Number(calcId)})`);
const calcsOfProject = (projectId: number) => literal(`(SELECT CAST(id AS CHAR) FROM calcs WHERE project_id = ${Number(projectId)})`);
const revisionsOfProject = (projectId: number) =>
  literal(`(SELECT CAST(r.id AS CHAR) FROM revisions r JOIN calcs c ON c.id = r.calc_id WHERE c.project_id = ${Number(projectId)})`);

/**
 * The audit trail filtered the way an auditor asks: by project or calc (the records under them:
 * the project, its calcs and every revision), by person, by action and by date (UTC days).
 */
export function auditWhere(q: AuditQuery): WhereOptions<AuditEvent> {
  const parts: WhereOptions<AuditEvent>[] = [];
  if (q.entityType) parts.push({ entityType: q.entityType });
  // A prefix match: LIKE wildcards in the text itself are escaped, so "auth.signed_in" means exactly that.
  if (q.action) parts.push({ action: { [Op.like]: `${q.action.replace(/[\\%_]/g, '\\$&')}%` } });
  if (q.userId) parts.push({ actorId: q.userId });
  if (q.from) parts.push({ occurredAt: { [Op.gte]: new Date(`${q.from}T00:00:00Z`) } });
  if (q.to) parts.push({ occurredAt: { [Op.lt]: new Date(new Date(`${q.to}T00:00:00Z`).getTime() + 86_400_000) } });
  if (q.calcId) {
    parts.push({ [Op.or]: [
      { entityType: 'Calc', entityId: String(q.calcId) },
      { entityType: 'Revision', entityId: { [Op.in]: revisionsOfCalc(q.calcId) } },
    ] });
  }
  if (q.projectId) {
    parts.push({ [Op.or]: [
      { entityType: 'Project', entityId: String(q.projectId) },
      { entityType: 'Calc', entityId: { [Op.in]: calcsOfProject(q.projectId) } },
      { entityType: 'Revision', entityId: { [Op.in]: revisionsOfProject(q.projectId) } },
    ] });
  }
  return { [Op.and]: parts };
}

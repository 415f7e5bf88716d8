import { Op, type WhereOptions } from 'sequelize';
import type { AuditQuery } from '../../shared/schemas/audit.schema';
import type { AuditEvent } from '../db/models';
import { likePrefix } from '../db/like-pattern';

/**
 * The audit trail filtered the way an auditor asks: by project or calc (the records under them:
 * the project, its calcs and every revision), by person, by action and by date (UTC days).
 */
export function auditWhere(q: Omit<AuditQuery, 'page'>): WhereOptions<AuditEvent> {
  const parts: WhereOptions<AuditEvent>[] = [];
  if (q.entityType) parts.push({ entityType: q.entityType });
  // A prefix match: LIKE wildcards in the text itself are escaped, so "auth.signed_in" means exactly that.
  if (q.action) parts.push({ action: { [Op.like]: likePrefix(q.action) } });
  if (q.userId) parts.push({ actorId: q.userId });
  if (q.from) parts.push({ occurredAt: { [Op.gte]: new Date(`${q.from}T00:00:00Z`) } });
  if (q.to) parts.push({ occurredAt: { [Op.lt]: new Date(new Date(`${q.to}T00:00:00Z`).getTime() + 86_400_000) } });
  // Each row names the calc and project it falls under (set when appended), each with its own index.
  if (q.calcId) parts.push({ calcId: q.calcId });
  if (q.projectId) parts.push({ projectId: q.projectId });
  if (q.after) parts.push({ id: { [Op.lt]: q.after } });
  return { [Op.and]: parts };
}

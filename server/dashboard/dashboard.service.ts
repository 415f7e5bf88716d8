import { Op } from 'sequelize';
import type { QueueDto, QueueKey } from '../../shared/schemas/queue.schema';
import type { DashboardDto, WaitingItem } from '../../shared/schemas/dashboard.schema';
import type { SessionUser } from '../../shared/schemas/auth.schema';
import type { AppAbility } from '../../shared/authz/app-ability';
import { Project, RuleSetRecord, User } from '../db/models';
import { accessibleWhere } from '../authz/accessible-where';
import { listAudit } from '../audit/audit-read.service';
import { AppError } from '../errors/app-error';
import { queueKeysOf, queuePage, type QueueQuery } from './queues';

/** Draft standards someone else proposed, waiting for this compliance person's confirmation. */
async function standardsToConfirm(ability: AppAbility, userId: number): Promise<WaitingItem[]> {
  if (!ability.can('publish', 'RuleSet')) return [];
  const rows = await RuleSetRecord.findAll({
    where: { status: 'draft', proposedBy: { [Op.and]: [{ [Op.ne]: null }, { [Op.ne]: userId }] }, confirmedBy: null },
    // What the line shows, not the standard's document.
    attributes: ['id', 'code', 'version', 'title', 'effectiveDate', 'updatedAt'],
    order: [['updatedAt', 'ASC']],
  });
  return rows.map((r) => ({
    kind: 'Standard to confirm',
    title: `${r.code} v${r.version} — ${r.title}`,
    detail: `proposed to take effect on ${r.effectiveDate}`,
    link: `/rule-sets/${r.id}`,
    since: r.updatedAt.toISOString(),
  }));
}

/** The overview: counts, the latest audit entries for those who read them, and items beyond the calc queues. */
export async function dashboardFor(ability: AppAbility, userId: number): Promise<DashboardDto> {
  const open = { [Op.and]: [accessibleWhere(ability, 'read', 'Project'), { status: 'active' }] };
  const admin = ability.can('create', 'User');
  // Independent reads, asked together so their round trips overlap.
  const [activeProjects, activeUsers, inactiveUsers, recent, waiting] = await Promise.all([
    Project.count({ where: open }),
    admin ? User.count({ where: { active: true } }) : undefined,
    admin ? User.count({ where: { active: false } }) : undefined,
    ability.can('read', 'AuditEvent') ? listAudit(ability, { page: 0, size: 8 }) : null,
    standardsToConfirm(ability, userId),
  ]);
  const counts: DashboardDto['counts'] = { activeProjects };
  if (admin) Object.assign(counts, { activeUsers, inactiveUsers });
  return { waiting, counts, recentActivity: recent?.items ?? null };
}

/** One of the person's own queues; another role's queue is a 403, not an empty page. */
export async function queueFor(
  user: SessionUser,
  ability: AppAbility,
  key: QueueKey,
  query: QueueQuery,
): Promise<QueueDto> {
  if (!queueKeysOf(user).includes(key)) throw new AppError('forbidden', 403, 'This queue belongs to another role');
  return queuePage(user, ability, key, query);
}

import { Router } from 'express';
import { Op } from 'sequelize';
import { z } from 'zod';
import { QUEUE_KEYS, type QueueKey } from '../../shared/schemas/queue.schema';
import type { DashboardDto, WaitingItem } from '../../shared/schemas/dashboard.schema';
import type { AppAbility } from '../../shared/authz/app-ability';
import { Project, RuleSetRecord, User } from '../db/models';
import { accessibleWhere } from '../authz/accessible-where';
import { listAudit } from '../audit/audit.router';
import { queueKeysOf, queuePage, queueQuerySchema, queuesOf } from './queues';
import { validate } from '../http/validate';
import { AppError } from '../errors/app-error';

const queueParamsSchema = z.object({ key: z.enum(QUEUE_KEYS, { error: 'is not a queue' }) });

/** Draft standards someone else proposed, waiting for this compliance person's confirmation. */
async function standardsToConfirm(ability: AppAbility, userId: number): Promise<WaitingItem[]> {
  if (!ability.can('publish', 'RuleSet')) return [];
  const rows = await RuleSetRecord.findAll({
    where: { status: 'draft', proposedBy: { [Op.and]: [{ [Op.ne]: null }, { [Op.ne]: userId }] }, confirmedBy: null }, order: [['updatedAt', 'ASC']],
  });
  return rows.map((r) => ({
    kind: 'Standard to confirm', title: `${r.code} v${r.version} — ${r.title}`,
    detail: `proposed to take effect on ${r.effectiveDate}`, link: `/rule-sets/${r.id}`, since: r.updatedAt.toISOString(),
  }));
}

/** The overview: counts, the latest audit entries for those who read them, and items beyond the calc queues. */
async function dashboardFor(ability: AppAbility, userId: number): Promise<DashboardDto> {
  const activeProjects = await Project.count({ where: { [Op.and]: [accessibleWhere(ability, 'read', 'Project'), { status: 'active' }] } });
  const counts: DashboardDto['counts'] = { activeProjects };
  if (ability.can('create', 'User')) {
    counts.activeUsers = await User.count({ where: { active: true } });
    counts.inactiveUsers = await User.count({ where: { active: false } });
  }
  const recentActivity = ability.can('read', 'AuditEvent')
    ? (await listAudit(ability, { page: 0, size: 8 })).items
    : null;
  return { waiting: await standardsToConfirm(ability, userId), counts, recentActivity };
}

export function dashboardRouter(): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await dashboardFor(req.ability, req.user!.id));
  });
  router.get('/queues', validate({ query: queueQuerySchema }), async (req, res) => {
    res.json(await queuesOf(req.user!, res.locals.query));
  });
  router.get('/queues/:key', validate({ params: queueParamsSchema, query: queueQuerySchema }), async (req, res) => {
    const key = req.params.key as QueueKey;
    if (!queueKeysOf(req.user!).includes(key)) throw new AppError('forbidden', 403, 'This queue belongs to another role');
    res.json(await queuePage(req.user!, key, res.locals.query));
  });
  return router;
}

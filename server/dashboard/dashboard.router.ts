import { Router } from 'express';
import { Op } from 'sequelize';
import type { DashboardDto } from '../../shared/schemas/dashboard.schema';
import type { AppAbility } from '../../shared/authz/app-ability';
import { Project, User } from '../db/models';
import { accessibleWhere } from '../authz/accessible-where';
import { listAudit } from '../audit/audit.router';
import { queuesOf } from './queues';

/**
 * "What waits for me": the hand-overs addressed to this person. Calcs and rule-set versions
 * add their items here as those areas arrive; until then the list is honestly empty.
 */
async function dashboardFor(ability: AppAbility): Promise<DashboardDto> {
  const activeProjects = await Project.count({ where: { [Op.and]: [accessibleWhere(ability, 'read', 'Project'), { status: 'active' }] } });
  const counts: DashboardDto['counts'] = { activeProjects };
  if (ability.can('create', 'User')) {
    counts.activeUsers = await User.count({ where: { active: true } });
    counts.inactiveUsers = await User.count({ where: { active: false } });
  }
  const recentActivity = ability.can('read', 'AuditEvent')
    ? (await listAudit(ability, { page: 0, size: 8 })).items
    : null;
  return { waiting: [], counts, recentActivity };
}

export function dashboardRouter(): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await dashboardFor(req.ability));
  });
  router.get('/queues', async (req, res) => {
    res.json(await queuesOf(req.user!));
  });
  return router;
}

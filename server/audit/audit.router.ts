import { Router } from 'express';
import { ForbiddenError } from '@casl/ability';
import { auditQuerySchema, type AuditEventDto, type AuditQuery } from '../../shared/schemas/audit.schema';
import type { AppAbility } from '../../shared/authz/app-ability';
import { AuditEvent } from '../db/models';
import { validate } from '../http/validate';
import { verifyAuditChain } from './audit.service';
import { auditWhere } from './audit-filter';

export function toAuditDto(e: AuditEvent): AuditEventDto {
  return {
    id: e.id, occurredAt: e.occurredAt.toISOString(), actorId: e.actorId, actorName: e.actorName, action: e.action,
    entityType: e.entityType, entityId: e.entityId, payload: JSON.parse(e.payload), diff: e.diff, prevHash: e.prevHash, hash: e.hash,
  };
}

export async function listAudit(ability: AppAbility, query: AuditQuery) {
  ForbiddenError.from(ability).throwUnlessCan('read', 'AuditEvent');
  const { rows, count } = await AuditEvent.findAndCountAll({ where: auditWhere(query), order: [['id', 'DESC']], offset: query.page * query.size, limit: query.size });
  return { items: rows.map(toAuditDto), total: count, page: query.page, size: query.size };
}

export function auditRouter(): Router {
  const router = Router();
  router.get('/', validate({ query: auditQuerySchema }), async (req, res) => {
    res.json(await listAudit(req.ability, res.locals.query));
  });
  router.get('/verify', async (req, res) => {
    ForbiddenError.from(req.ability).throwUnlessCan('read', 'AuditEvent');
    res.json({ ...(await verifyAuditChain()), checkedAt: new Date().toISOString() });
  });
  return router;
}

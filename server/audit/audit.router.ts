import { Router } from 'express';
import { Op } from 'sequelize';
import { ForbiddenError } from '@casl/ability';
import { auditQuerySchema, type AuditEventDto, type AuditQuery } from '../../shared/schemas/audit.schema';
import type { AppAbility } from '../../shared/authz/app-ability';
import { AuditEvent } from '../db/models';
import { validate } from '../http/validate';
import { verifyAuditChain } from './audit.service';
import { auditWhere } from './audit-filter';
import { describeRecords, recordOf } from './audit-records';

export function toAuditDto(e: AuditEvent): AuditEventDto {
  return {
    id: e.id, occurredAt: e.occurredAt.toISOString(), actorId: e.actorId, actorName: e.actorName, action: e.action,
    entityType: e.entityType, entityId: e.entityId, payload: JSON.parse(e.payload), diff: e.diff, prevHash: e.prevHash, hash: e.hash,
  };
}

export async function listAudit(ability: AppAbility, query: AuditQuery) {
  ForbiddenError.from(ability).throwUnlessCan('read', 'AuditEvent');
  const { rows, count } = await AuditEvent.findAndCountAll({ where: auditWhere(query), order: [['id', 'DESC']], offset: query.page * query.size, limit: query.size });
  const refs = await describeRecords(rows);
  return { items: rows.map((r) => ({ ...toAuditDto(r), record: recordOf(refs, r) })), total: count, page: query.page, size: query.size };
}

export function auditRouter(): Router {
  const router = Router();
  router.get('/', validate({ query: auditQuerySchema }), async (req, res) => {
    res.json(await listAudit(req.ability, res.locals.query));
  });
  // The people who appear in the trail, for the auditor's person picker (compliance cannot list accounts).
  router.get('/people', async (req, res) => {
    ForbiddenError.from(req.ability).throwUnlessCan('read', 'AuditEvent');
    const rows = await AuditEvent.findAll({ attributes: ['actorId', 'actorName'], where: { actorId: { [Op.ne]: null } }, group: ['actorId', 'actorName'], order: [['actorName', 'ASC']], raw: true });
    const people = new Map<number, string>();
    for (const r of rows) if (r.actorId !== null && !people.has(r.actorId)) people.set(r.actorId, r.actorName);
    res.json([...people].map(([id, name]) => ({ id, name })));
  });
  router.get('/verify', async (req, res) => {
    ForbiddenError.from(req.ability).throwUnlessCan('read', 'AuditEvent');
    res.json({ ...(await verifyAuditChain()), checkedAt: new Date().toISOString() });
  });
  return router;
}

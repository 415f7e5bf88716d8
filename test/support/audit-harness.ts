import { Op } from 'sequelize';
import { AuditEvent } from '../../server/db/models';

/** Audit rows of one entity, oldest first, read from the table (the API has no per-entity filter). */
export async function auditOf(entityType: string, entityId: number, since = 0) {
  const rows = await AuditEvent.findAll({
    where: { entityType, entityId: String(entityId), id: { [Op.gt]: since } },
    order: [['id', 'ASC']],
  });
  return rows.map((r) => ({
    id: r.id,
    action: r.action,
    actorId: r.actorId,
    actorName: r.actorName,
    payload: JSON.parse(r.payload),
    diff: r.diff,
  }));
}

export async function lastAuditId(): Promise<number> {
  return (await AuditEvent.max<number, AuditEvent>('id')) ?? 0;
}

import { Op, QueryTypes } from 'sequelize';
import { AuditEvent } from '../db/models';
import { chainHash, GENESIS_HASH, type ChainedContent } from './audit-chain';

/**
 * Walks the whole chain in id order and reports the first row whose hash or link does not match.
 * The chain head must end where the walk ends, or rows were cut off the end of the trail.
 */
export async function verifyAuditChain(): Promise<{ ok: boolean; checked: number; brokenAt?: number }> {
  let prev = GENESIS_HASH;
  let checked = 0;
  let lastId = 0;
  for (;;) {
    const rows = await AuditEvent.findAll({ where: { id: { [Op.gt]: lastId } }, order: [['id', 'ASC']], limit: 1000 });
    if (rows.length === 0) {
      const [head] = await AuditEvent.sequelize!.query<{ last_id: number | null; last_hash: string }>(
        'SELECT last_id, last_hash FROM audit_chain_head WHERE id = 1',
        { type: QueryTypes.SELECT },
      );
      if (head.last_hash === prev) return { ok: true, checked };
      // Rows appended since the walk's last read move the head on; walk on to them.
      if ((await AuditEvent.count({ where: { id: { [Op.gt]: lastId } } })) > 0) continue;
      return { ok: false, checked, brokenAt: Number(head.last_id) };
    }
    for (const r of rows) {
      const content: ChainedContent = {
        occurredAt: r.occurredAt.toISOString(),
        actorId: r.actorId,
        actorName: r.actorName,
        action: r.action,
        entityType: r.entityType,
        entityId: r.entityId,
        payload: r.payload,
        diff: r.diff,
        ip: r.ip,
      };
      if (r.prevHash !== prev || chainHash(prev, content) !== r.hash) return { ok: false, checked, brokenAt: r.id };
      prev = r.hash;
      lastId = r.id;
      checked++;
    }
  }
}

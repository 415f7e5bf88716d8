import type { Sequelize, Transaction } from 'sequelize';
import { Op, QueryTypes } from 'sequelize';
import canonicalize from 'canonicalize';
import { AuditEvent } from '../db/models';
import { chainHash, GENESIS_HASH, type ChainedContent } from './audit-chain';
import { runTransaction } from '../db/transaction';

export interface Actor {
  id: number | null;
  name: string;
  ip?: string | null;
}

export interface AuditEntry {
  action: string;
  entityType: string;
  entityId?: string | number | null;
  payload?: unknown;
  diff?: string | null;
}

/**
 * Appends one event to the hash-chained audit trail. The chain head row is locked for the
 * length of the transaction, so concurrent appends from several app instances line up one
 * behind the other and every row's `prevHash` is the row before it. Pass the caller's
 * transaction so the audit entry commits (or rolls back) with the change it records.
 */
export async function appendAudit(
  sequelize: Sequelize,
  actor: Actor,
  entry: AuditEntry,
  transaction?: Transaction,
): Promise<void> {
  const run = async (t: Transaction) => {
    // Before the chain head is locked, so the look-up does not lengthen the time every writer waits.
    const scope = await scopeOf(sequelize, entry, t);
    const [head] = await sequelize.query<{ last_hash: string; now: Date }>(
      'SELECT last_hash, UTC_TIMESTAMP(3) AS now FROM audit_chain_head WHERE id = 1 FOR UPDATE',
      { type: QueryTypes.SELECT, transaction: t },
    );
    const content: ChainedContent = {
      occurredAt: new Date(head.now).toISOString(),
      actorId: actor.id,
      actorName: actor.name,
      action: entry.action,
      entityType: entry.entityType,
      entityId: entry.entityId == null ? null : String(entry.entityId),
      payload: canonicalize(entry.payload ?? {}) ?? '{}',
      diff: entry.diff ?? null,
      ip: actor.ip ?? null,
    };
    const hash = chainHash(head.last_hash, content);
    const row = await AuditEvent.create(
      { ...content, occurredAt: new Date(content.occurredAt), prevHash: head.last_hash, hash, ...scope },
      { transaction: t },
    );
    await sequelize.query('UPDATE audit_chain_head SET last_id = ?, last_hash = ? WHERE id = 1', {
      replacements: [row.id, hash],
      transaction: t,
    });
  };
  if (transaction) return run(transaction);
  return runTransaction(sequelize, run);
}

const SCOPE_SQL: Record<string, string> = {
  Calc: 'SELECT id AS calcId, project_id AS projectId FROM calcs WHERE id = ?',
  Revision:
    'SELECT c.id AS calcId, c.project_id AS projectId FROM revisions r JOIN calcs c ON c.id = r.calc_id WHERE r.id = ?',
};

/**
 * The calc and project an entry falls under, for the audit list's filters (migrations/20261220-0302-audit-scope.ts).
 */
async function scopeOf(
  sequelize: Sequelize,
  entry: AuditEntry,
  t: Transaction,
): Promise<{ calcId: number | null; projectId: number | null }> {
  const id = entry.entityId == null ? NaN : Number(entry.entityId);
  if (!Number.isInteger(id)) return { calcId: null, projectId: null };
  if (entry.entityType === 'Project') return { calcId: null, projectId: id };
  const sql = SCOPE_SQL[entry.entityType];
  if (!sql) return { calcId: null, projectId: null };
  const [row] = await sequelize.query<{ calcId: number; projectId: number }>(sql, {
    replacements: [id],
    type: QueryTypes.SELECT,
    transaction: t,
  });
  return { calcId: row?.calcId ?? null, projectId: row?.projectId ?? null };
}

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

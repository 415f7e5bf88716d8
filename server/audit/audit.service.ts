import type { Sequelize, Transaction } from 'sequelize';
import { QueryTypes } from 'sequelize';
import { plainRun } from '../db/plain-query';
import canonicalize from 'canonicalize';
import type { ChainedContent } from './audit-chain';
import { committedByDatabase, runTransaction } from '../db/transaction';
import { timed, timeSince } from '../http/server-timing';

// The chain's verification lives beside the append; callers keep importing it from here.
export { verifyAuditChain } from './audit-verify';

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
  /** The calc and project the entry falls under, when the caller already knows them (else looked up). */
  scope?: { calcId: number | null; projectId: number | null };
  /**
   * The entry is the last statement of the caller's transaction: the database commits it right after the append
   * (`audit_append_commit`), so the head is freed without a trip back to the app. Only for work run with
   * `idempotent: true`: a connection lost during that statement may have committed, and the work runs again.
   */
  commits?: true;
}

/**
 * Appends one event to the hash-chained audit trail. The chain head row is locked until the
 * transaction commits, so concurrent appends from several app instances line up one behind the
 * other and every row's `prevHash` is the row before it. Pass the caller's transaction so the
 * audit entry commits (or rolls back) with the change it records, and call this as the last
 * statement before the commit: everything else (the scope look-up, the canonical JSON) is done
 * before the lock, and the lock, the hash, the insert and the head's move are one statement
 * (`audit_append`, migrations/20261231-06-saves-audit-append.ts), so the head is held for one
 * round trip and the commit.
 */
export async function appendAudit(
  sequelize: Sequelize,
  actor: Actor,
  entry: AuditEntry,
  transaction?: Transaction,
): Promise<void> {
  const run = async (t: Transaction) => {
    const scope = entry.scope ?? (await scopeOf(sequelize, entry, t));
    const c: ChainedContent = {
      occurredAt: TIME_MARK,
      actorId: actor.id,
      actorName: actor.name,
      action: entry.action,
      entityType: entry.entityType,
      entityId: entry.entityId == null ? null : String(entry.entityId),
      payload: canonicalize(entry.payload ?? {}) ?? '{}',
      diff: entry.diff ?? null,
      ip: actor.ip ?? null,
    };
    const { before, after } = canonicalHalves(c);
    const params = [c.actorId, c.actorName, c.action, c.entityType, c.entityId, c.payload, c.diff, c.ip];
    // `chain`: waiting for the head, then the append; `chain-held`: from the append to the commit that frees it.
    await timed('chain', () =>
      plainRun(
        sequelize,
        `CALL ${entry.commits ? 'audit_append_commit' : 'audit_append'}(?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
        [...params, scope.calcId, scope.projectId, before, after],
        t,
      ),
    );
    // An append that commits has already freed the head, and ended the transaction: runTransaction sends no COMMIT.
    if (entry.commits) return committedByDatabase(t);
    const since = process.hrtime.bigint();
    t.afterCommit(() => timeSince('chain-held', since));
  };
  if (transaction) return run(transaction);
  return runTransaction(sequelize, run);
}

// A stand-in for the time in the canonical JSON; the database puts the time it takes under the lock in its place.
const TIME_MARK = '0000-00-00T00:00:00.000Z';

/**
 * The canonical JSON (RFC 8785, as chainHash hashes it) split where the time goes. Keys are sorted and every value
 * is a string, a number or null, so `"occurredAt":"` occurs once outside a string: quotes inside strings are escaped.
 */
function canonicalHalves(content: ChainedContent): { before: string; after: string } {
  const text = canonicalize(content) ?? '';
  const key = `"occurredAt":"${TIME_MARK}"`;
  const at = text.indexOf(key);
  return { before: text.slice(0, at + 14), after: text.slice(at + key.length - 1) };
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

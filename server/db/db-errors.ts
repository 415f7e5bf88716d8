import { BaseError, ConnectionError, DatabaseError, TimeoutError } from 'sequelize';

/**
 * What a database error means for the transaction that met it. The codes are MariaDB's:
 * - 1213 ER_LOCK_DEADLOCK: InnoDB chose this transaction as a deadlock victim, or Galera's
 *   certification (or a brute-force abort by a replicated write) failed it at commit. Rolled back.
 * - 1205 ER_LOCK_WAIT_TIMEOUT: a lock was not granted in time. We roll the transaction back ourselves.
 * - 1047 ER_UNKNOWN_COM_ERROR ("WSREP has not yet prepared node for application use"): the node
 *   left the primary component or is still joining; the statement was refused before it ran.
 * - 1180 ER_ERROR_DURING_COMMIT: the commit itself failed and was rolled back; Galera reports so a
 *   node that lost the primary component while a failed node was being dropped from the cluster.
 * - 1927 ER_CONNECTION_KILLED and 4031 (idle disconnect): the server ended the connection.
 */
const ROLLED_BACK_CODES = new Set([1213, 1205, 1047, 1180]);
const CONNECTION_CODES = new Set([1927, 4031, 2006, 2013]);
// Codes of the mariadb connector for a socket that closed or never opened.
const CONNECTOR_CODES = new Set([
  'ER_SOCKET_UNEXPECTED_CLOSE',
  'ER_CONNECTION_TIMEOUT',
  'ER_GET_CONNECTION_TIMEOUT',
  'ECONNRESET',
  'ECONNREFUSED',
  'EPIPE',
  'ETIMEDOUT',
  'ER_CONNECTION_ALREADY_CLOSED',
  'ER_CMD_CONNECTION_CLOSED',
]);

export type DbFault = 'rolled_back' | 'connection' | undefined;

function driverError(err: unknown): { errno?: number; code?: string } | undefined {
  if (!err || typeof err !== 'object') return undefined;
  const e = err as { parent?: unknown; original?: unknown; errno?: number; code?: string };
  return (e.parent ?? e.original ?? e) as { errno?: number; code?: string };
}

/**
 * `rolled_back`: the database undid the whole transaction and said so; running it again is the
 * documented remedy. `connection`: the connection broke, so the database rolls back whatever had
 * not committed; only a failed COMMIT leaves the outcome unknown (see runTransaction).
 */
export function classifyDbError(err: unknown): DbFault {
  if (!(err instanceof BaseError) && !driverError(err)?.errno && !driverError(err)?.code) return undefined;
  const d = driverError(err) ?? {};
  if (d.errno !== undefined && ROLLED_BACK_CODES.has(d.errno)) return 'rolled_back';
  if (d.errno !== undefined && CONNECTION_CODES.has(d.errno)) return 'connection';
  if (d.code && CONNECTOR_CODES.has(d.code)) return 'connection';
  if (err instanceof ConnectionError || err instanceof TimeoutError) return 'connection';
  if (err instanceof DatabaseError && /WSREP|Primary Component/i.test(err.message)) return 'rolled_back';
  return undefined;
}

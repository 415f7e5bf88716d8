import type { Sequelize, Transaction } from 'sequelize';
import { injectReplacements } from 'sequelize/lib/utils/sql';

/*
 * A hot read sent to the MariaDB driver on one of Sequelize's pooled connections, past Sequelize's query pipeline.
 * That pipeline (options merged and cloned, the replacements scanned character by character, a stack captured for
 * every statement, hooks, the query object, the result formatted) cost about 0.1 ms of the app's CPU for the
 * session's own statement, as much as the driver's whole round trip, on every request (DEVELOPERS.md, "The machine's
 * floor, measured"). The connection is the pool's, so the same limits, time-outs and type decoding apply, and an
 * error is the one Sequelize would have thrown (formatted by its own query class), so retries and 503s are unchanged.
 */

/**
 * What a plain statement's `?` may stand for: text, a number, a list (written `a,b,c`, as Sequelize's replacements
 * write it) or a Date, written as the database session's UTC text (the driver alone would write it in the
 * connection's zone, which is not the session's when the process keeps another zone, server/db/index.ts).
 */
const valueOf = (v: unknown): unknown => {
  if (v instanceof Date) return sqlTime(v);
  if (v === null || Array.isArray(v) || ['string', 'number', 'bigint', 'boolean'].includes(typeof v)) return v;
  throw new TypeError(`a plain statement's value must be text, a number, a list or a time, not ${typeof v}`);
};

interface DriverConnection {
  query(sql: string, values?: readonly unknown[]): Promise<unknown>;
}
interface ConnectionManager {
  getConnection(options: { type: 'SELECT' | 'SQL' }): Promise<DriverConnection>;
  releaseConnection(connection: DriverConnection): void;
}
type QueryClass = new (
  connection: DriverConnection,
  sequelize: Sequelize,
  options: object,
) => { formatError(err: unknown, stack?: string): Error };

const managerOf = (sequelize: Sequelize) =>
  (sequelize as unknown as { connectionManager: ConnectionManager }).connectionManager;

/**
 * Rows of a SELECT, as `sequelize.query(sql, { replacements, type: QueryTypes.SELECT, transaction })` gives them: in
 * the transaction's connection when there is one, else on a connection of the pool for this statement alone. `values`
 * are checked as they are sent (valueOf): a caller's parameters are often typed unknown[].
 */
export async function plainSelect<T extends object>(
  sequelize: Sequelize,
  sql: string,
  values: readonly unknown[] = [],
  transaction?: Transaction | null,
): Promise<T[]> {
  return rowsOnly<T>(await send(sequelize, sql, values, transaction, 'SELECT'));
}

/** A statement whose answer is not read (a CALL that appends to the audit chain), as plainSelect sends a SELECT. */
export async function plainRun(
  sequelize: Sequelize,
  sql: string,
  values: readonly unknown[],
  transaction: Transaction,
): Promise<void> {
  await send(sequelize, sql, values, transaction, 'SQL');
}

/**
 * Rows of a SELECT sent as plainSelect sends it, with the number of warnings it raised when `asked(rows)` says they
 * matter: read as `@@warning_count` on the same connection before it goes back to the pool (the driver does not pass
 * on the count the server sends with the rows). A statement cut short by `LIMIT … ROWS EXAMINED` says so only so.
 */
export async function plainSelectWarned<T extends object>(
  sequelize: Sequelize,
  sql: string,
  values: readonly unknown[],
  asked: (rows: T[]) => boolean,
): Promise<{ rows: T[]; warnings: number }> {
  let warnings = 0;
  const result = await send(sequelize, sql, values, null, 'SELECT', async (connection, found) => {
    if (!asked(found as T[])) return;
    const [row] = (await connection.query('SELECT @@warning_count AS n')) as { n: number | bigint }[];
    warnings = Number(row.n);
  });
  return { rows: rowsOnly<T>(result), warnings };
}

/** A driver's rows as Sequelize gives them: the column metadata the driver hangs on the array left off. */
function rowsOnly<T>(result: unknown): T[] {
  const rows = result as T[] & { meta?: unknown };
  delete rows.meta;
  return rows;
}

async function send(
  sequelize: Sequelize,
  sql: string,
  values: readonly unknown[],
  transaction: Transaction | null | undefined,
  type: 'SELECT' | 'SQL',
  then?: (connection: DriverConnection, result: unknown) => Promise<void>,
): Promise<unknown> {
  const manager = managerOf(sequelize);
  const sent = values.map(valueOf);
  // As Sequelize refuses it: a finished transaction's connection is back in the pool, perhaps another request's now.
  const held = transaction as unknown as { connection?: DriverConnection; finished?: string } | null | undefined;
  if (held && (held.finished || !held.connection)) {
    throw new Error(`${held.finished ?? 'end'} has been called on this transaction; it can no longer be used`);
  }
  const own = held?.connection;
  const connection = own ?? (await manager.getConnection({ type }));
  logged(sequelize, sql, sent);
  try {
    const result = await connection.query(sql, sent);
    await then?.(connection, result);
    return result;
  } catch (err) {
    const Query = (sequelize as unknown as { dialect: { Query: QueryClass } }).dialect.Query;
    throw new Query(connection, sequelize, { transaction }).formatError(
      Object.assign(err as object, { sql }),
      new Error().stack,
    );
  } finally {
    if (!own) manager.releaseConnection(connection);
  }
}

/** A moment as the database session stores a DATETIME(3): UTC, `YYYY-MM-DD hh:mm:ss.sss`. */
export const sqlTime = (at: Date): string => at.toISOString().slice(0, 23).replace('T', ' ');

/**
 * Handed to Sequelize's `logging` as it would log the statement (values written in), so the trace log and the specs
 * that read the statements through it (test/support/explain-harness.ts) see plain statements too. Written in only
 * when there is a logging function: the app sets none unless it logs at trace level (server/db/index.ts).
 */
function logged(sequelize: Sequelize, sql: string, values: readonly unknown[]): void {
  const logging = (sequelize as unknown as { options: { logging?: unknown } }).options.logging;
  if (typeof logging !== 'function') return;
  const dialect = (sequelize as unknown as { dialect: Parameters<typeof injectReplacements>[1] }).dialect;
  logging(`Executing (default): ${injectReplacements(sql, dialect, values as unknown[])}`);
}

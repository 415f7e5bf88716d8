import type { Sequelize, Transaction } from 'sequelize';
import { AppError } from '../errors/app-error';
import { logger } from '../logger';
import { classifyDbError } from './db-errors';
import { timed } from '../http/server-timing';

export interface TransactionOptions {
  /**
   * True when running the work a second time after it may already have committed does no harm:
   * the work itself recognises its own earlier commit (a sign-off's idempotency key, a save whose
   * stored version and content are already the ones asked for). Only such work is retried when
   * the connection breaks during COMMIT; everything else then answers 503 and the client reloads.
   */
  idempotent?: boolean;
}

/** Attempts in all, and the time after which no new attempt starts (a request never hangs on us). */
export const RETRY_LIMITS = { attempts: 6, budgetMs: 7_000, baseDelayMs: 15, maxDelayMs: 800 };
/** Counters since the process started, for the bench and the logs. */
export const retryStats = { transactions: 0, retries: 0, gaveUp: 0, byCause: {} as Record<string, number> };

export const RETRY_AFTER_SECONDS = 2;

/** Transactions whose last statement committed them inside the database (`audit_append_commit`). */
const committedInside = new WeakSet<Transaction>();

/**
 * Called by the work right after a statement that ended with COMMIT inside the database returned: runTransaction
 * then sends no COMMIT of its own (it would find no transaction and do nothing, one round trip) and only hands the
 * connection back to the pool and runs the afterCommit hooks, as Sequelize's commit() does after its COMMIT.
 */
export function committedByDatabase(t: Transaction): void {
  committedInside.add(t);
}

async function finishCommitted(t: Transaction): Promise<void> {
  // Sequelize's own commit() minus the statement: cleanup() releases the connection; then the state and hooks.
  const internal = t as unknown as {
    cleanup(): void;
    finished?: string;
    _afterCommitHooks: ((t: Transaction) => unknown)[];
  };
  internal.cleanup();
  internal.finished = 'commit';
  for (const hook of internal._afterCommitHooks) await hook.apply(t, [t]);
}

/**
 * Runs `work` in one transaction and runs the whole of it again when the database aborted it for
 * a deadlock (1213, also Galera's certification failure at commit), a lock-wait timeout (1205) or
 * a node that is not ready (1047), or when the connection broke before COMMIT was sent (the
 * server rolls such a transaction back). Waits between attempts grow and are jittered ("full
 * jitter") so that the transactions that collided do not collide again. `work` must do all its
 * reading inside the transaction: a retry starts from fresh rows. Every write service uses this.
 */
export async function runTransaction<T>(
  sequelize: Sequelize,
  work: (t: Transaction, attempt: number) => Promise<T>,
  options: TransactionOptions = {},
): Promise<T> {
  const started = Date.now();
  retryStats.transactions++;
  for (let attempt = 1; ; attempt++) {
    let t: Transaction | undefined;
    let committing = false;
    try {
      t = await sequelize.transaction();
      const result = await work(t, attempt);
      committing = true;
      if (committedInside.has(t)) await finishCommitted(t);
      else await timed('commit', () => t!.commit());
      return result;
    } catch (err) {
      if (t && !committing) await t.rollback().catch(() => undefined);
      const fault = classifyDbError(err);
      if (!fault) throw err;
      const cause = causeOf(err, fault);
      // A COMMIT whose connection broke may have committed: only idempotent work may find out by running again.
      if (fault === 'connection' && committing && !options.idempotent) throw unknownOutcome(err);
      const delay = backoff(attempt);
      if (attempt >= RETRY_LIMITS.attempts || Date.now() - started + delay > RETRY_LIMITS.budgetMs) {
        retryStats.gaveUp++;
        logger.warn({ cause, attempts: attempt }, 'transaction abandoned after retries');
        throw unavailable(err);
      }
      retryStats.retries++;
      retryStats.byCause[cause] = (retryStats.byCause[cause] ?? 0) + 1;
      logger.info({ cause, attempt, delay }, 'transaction retried');
      await new Promise((resolve) => setTimeout(resolve, delay));
    }
  }
}

/** Exponential growth capped at maxDelayMs, then a uniformly random wait below it. */
export function backoff(attempt: number): number {
  const cap = Math.min(RETRY_LIMITS.maxDelayMs, RETRY_LIMITS.baseDelayMs * 2 ** (attempt - 1));
  return Math.round(Math.random() * cap);
}

function causeOf(err: unknown, fault: string): string {
  const d = (err as { parent?: { errno?: number; code?: string } }).parent;
  return d?.errno ? `${d.errno}` : (d?.code ?? fault);
}

/** The clean answer a client may retry: nothing was changed, come back shortly. */
export function unavailable(cause?: unknown): AppError {
  return new AppError(
    'unavailable',
    503,
    'The database is busy or switching over; nothing was changed. Try again in a moment.',
    { retryAfterSeconds: RETRY_AFTER_SECONDS },
    true,
    { cause },
  );
}

function unknownOutcome(cause: unknown): AppError {
  return new AppError(
    'unavailable',
    503,
    'The connection to the database broke while the change was being committed; reload to see whether it was recorded before trying again.',
    { retryAfterSeconds: RETRY_AFTER_SECONDS },
    true,
    { cause },
  );
}

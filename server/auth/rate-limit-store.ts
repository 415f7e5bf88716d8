import { createHash } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import { runTransaction } from '../db/transaction';
import { logger } from '../logger';

const MAX_KEY_LENGTH = 191;
const SWEEP_EVERY = 100;

// The upsert restarts an expired window in place; `hits` is assigned before `reset_at`, so both
// IF()s still see the old `reset_at` (MariaDB evaluates the assignments left to right).
const UPSERT = `INSERT INTO rate_limit_hits (rate_key, hits, reset_at)
  VALUES (:key, 1, UTC_TIMESTAMP(3) + INTERVAL :windowUs MICROSECOND)
  ON DUPLICATE KEY UPDATE
    hits = IF(reset_at <= UTC_TIMESTAMP(3), 1, hits + 1),
    reset_at = IF(reset_at <= UTC_TIMESTAMP(3), VALUES(reset_at), reset_at)`;
const SELECT = 'SELECT hits, reset_at FROM rate_limit_hits WHERE rate_key = :key';
const SELECT_LIVE = `${SELECT} AND reset_at > UTC_TIMESTAMP(3)`;
const DECREMENT = `UPDATE rate_limit_hits SET hits = IF(hits > 0, hits - 1, 0)
  WHERE rate_key = :key AND reset_at > UTC_TIMESTAMP(3)`;

interface Row {
  hits: number;
  reset_at: Date | string;
}

/**
 * An express-rate-limit store on MariaDB, so the count holds across app instances and restarts
 * (the built-in memory store counts per process). Windows are measured on the database clock,
 * so instances with drifting clocks still agree on when a window ends.
 */
export class MariaDbRateLimitStore implements Store {
  readonly localKeys = false;
  readonly prefix: string;
  #windowMs = 60_000;
  #sinceSweep = 0;

  constructor(
    private readonly sequelize: Sequelize,
    options: { prefix?: string } = {},
  ) {
    this.prefix = options.prefix ?? 'rl:';
  }

  init(options: Options): void {
    this.#windowMs = options.windowMs;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [row] = await this.sequelize.query<Row>(SELECT_LIVE, {
      type: QueryTypes.SELECT,
      replacements: { key: this.#key(key) },
    });
    return row ? toInfo(row) : undefined;
  }

  /** Counts one hit; the row lock taken by the upsert makes the read that follows our own. */
  async increment(key: string): Promise<ClientRateLimitInfo> {
    await this.#sweepSometimes();
    const replacements = { key: this.#key(key), windowUs: Math.round(this.#windowMs * 1000) };
    return runTransaction(this.sequelize, async (transaction) => {
      await this.sequelize.query(UPSERT, { replacements, transaction });
      const [row] = await this.sequelize.query<Row>(SELECT, { type: QueryTypes.SELECT, replacements, transaction });
      return toInfo(row);
    });
  }

  // Retried like the upsert: the sweep's range delete can deadlock with it, and a lost decrement would count a
  // successful sign-in as a failed attempt.
  async decrement(key: string): Promise<void> {
    await this.#write(DECREMENT, { key: this.#key(key) });
  }

  async resetKey(key: string): Promise<void> {
    await this.#write('DELETE FROM rate_limit_hits WHERE rate_key = :key', { key: this.#key(key) });
  }

  async resetAll(): Promise<void> {
    await this.#write('DELETE FROM rate_limit_hits WHERE rate_key LIKE :pattern', {
      pattern: `${this.prefix.replace(/[\\%_]/g, '\\$&')}%`,
    });
  }

  // Keys arrive before the body is validated, so an attacker controls their length: hash long ones.
  #key(key: string): string {
    const full = `${this.prefix}${key}`;
    if (full.length <= MAX_KEY_LENGTH) return full;
    return `${this.prefix}sha256:${createHash('sha256').update(key).digest('hex')}`;
  }

  /** One statement in a transaction of its own, run again on a deadlock or lock-wait timeout. */
  async #write(sql: string, replacements: Record<string, string>): Promise<void> {
    await runTransaction(this.sequelize, (transaction) => this.sequelize.query(sql, { replacements, transaction }));
  }

  // Expired rows are harmless (the upsert restarts them) but would pile up; clear them now and then. The delete locks
  // a range of the reset_at index, which other instances' upserts also write, so it is retried on a deadlock; if it
  // still fails, the next sweep clears the rows, and the sign-in that ran it must not fail for housekeeping.
  async #sweepSometimes(): Promise<void> {
    if (++this.#sinceSweep < SWEEP_EVERY) return;
    this.#sinceSweep = 0;
    await this.#write('DELETE FROM rate_limit_hits WHERE reset_at < UTC_TIMESTAMP(3) LIMIT 1000', {}).catch((err) =>
      logger.warn({ err }, 'rate-limit sweep skipped; the next one clears the expired rows'),
    );
  }
}

function toInfo(row: Row): ClientRateLimitInfo {
  const resetTime = row.reset_at instanceof Date ? row.reset_at : new Date(`${row.reset_at.replace(' ', 'T')}Z`);
  return { totalHits: Number(row.hits), resetTime };
}

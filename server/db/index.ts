import { Sequelize, type Options } from 'sequelize';
import type { Config } from '../config';
import { logger } from '../logger';
import { initModels } from './models';

/**
 * Whether this process keeps local time in UTC (TZ unset in a container, TZ=UTC or one of its aliases, which ICU
 * names UTC; an empty TZ, which the C library takes as UTC, ICU names Etc/Unknown). A zone at UTC today that was not
 * always (Atlantic/Reykjavik before 1968) does not count: its old timestamps would read an hour off. The database
 * session runs in UTC (`timezone` below), so the driver's own decoding, which reads a DATETIME's text as local time,
 * is then right, and Sequelize's per-value type cast can be left out: with a cast the driver calls it for every
 * column of every row through its slow path (8.5 % of the app's CPU on a calc list, V8 profile; DEVELOPERS.md,
 * "Measuring speed"). Elsewhere the cast stays, which reads the text as UTC whatever the local zone.
 */
export function processClockIsUtc(zone = Intl.DateTimeFormat().resolvedOptions().timeZone): boolean {
  const utcNow = [0, 6].every((month) => new Date(Date.UTC(2026, month, 1)).getTimezoneOffset() === 0);
  return zone === 'UTC' || (zone === 'Etc/Unknown' && utcNow);
}

/** The driver's own decoding (Sequelize's only casts are for DATETIME and DATE; DATE is mended by its getter). */
const DRIVER_DECODING = { typeCast: undefined, timezone: 'local' };

/** Sequelize's options for this app (`decoding`: specs compare the two). */
export function sequelizeOptions(
  config: Config,
  decoding: 'driver' | 'cast' = processClockIsUtc() ? 'driver' : 'cast',
): Options {
  return {
    host: config.DB_HOST,
    port: config.DB_PORT,
    dialect: 'mariadb',
    timezone: '+00:00',
    // Only when tracing: Sequelize builds each statement's log line before calling this (plain-query.ts too).
    logging: logger.isLevelEnabled('trace') ? (sql) => logger.trace({ sql }, 'sql') : false,
    pool: { max: config.DB_POOL_MAX, min: 0, idle: 10_000, acquire: config.DB_ACQUIRE_MS },
    dialectOptions: { connectTimeout: 10_000, ...(decoding === 'driver' ? DRIVER_DECODING : {}) },
    define: { underscored: true },
  };
}

/** One Sequelize instance per process, with every model initialised on it. */
export function createSequelize(config: Config): Sequelize {
  const sequelize = new Sequelize(config.DB_NAME, config.DB_USER, config.DB_PASSWORD, sequelizeOptions(config));
  initModels(sequelize);
  return sequelize;
}

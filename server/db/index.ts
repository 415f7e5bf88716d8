import { Sequelize } from 'sequelize';
import type { Config } from '../config';
import { logger } from '../logger';
import { initModels } from './models';

/** One Sequelize instance per process, with every model initialised on it. */
export function createSequelize(config: Config): Sequelize {
  const sequelize = new Sequelize(config.DB_NAME, config.DB_USER, config.DB_PASSWORD, {
    host: config.DB_HOST,
    port: config.DB_PORT,
    dialect: 'mariadb',
    timezone: '+00:00',
    logging: (sql) => logger.trace({ sql }, 'sql'),
    pool: { max: config.DB_POOL_MAX, min: 0, idle: 10_000, acquire: config.DB_ACQUIRE_MS },
    dialectOptions: { connectTimeout: 10_000 },
    define: { underscored: true },
  });
  initModels(sequelize);
  return sequelize;
}

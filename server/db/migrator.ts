import path from 'node:path';
import { Umzug, SequelizeStorage } from 'umzug';
import type { Sequelize } from 'sequelize';
import { logger } from '../logger';

/**
 * Migrations are TypeScript files in migrations/. The extension is stripped from each name so
 * that runs under tsx and under compiled JavaScript record the same names in `migrations_meta`.
 */
export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: {
      glob: ['migrations/*.{ts,js}', { cwd: path.resolve(__dirname, '../..'), ignore: ['**/*.d.ts'] }],
      resolve: ({ name, path: file, context }) => {
        // eslint-disable-next-line @typescript-eslint/no-require-imports
        const migration = require(file!);
        return {
          name: name.replace(/\.(ts|js)$/, ''),
          up: async () => migration.up({ context }),
          down: async () => migration.down({ context }),
        };
      },
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'migrations_meta' }),
    logger: {
      info: (m) => logger.debug(m),
      warn: (m) => logger.warn(m),
      error: (m) => logger.error(m),
      debug: () => {},
    },
  });
}

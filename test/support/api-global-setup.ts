// Runs once before the API and end-to-end projects: brings the throw-away test database
// (started by scripts/test.sh) up to the latest migration.
import { loadConfig } from '../../server/config';
import { createSequelize } from '../../server/db';
import { createMigrator } from '../../server/db/migrator';

export default async function globalSetup(): Promise<void> {
  const config = loadConfig();
  if (config.DB_NAME !== 'torquetrail_test' && !process.env.ALLOW_NON_TEST_DB) {
    throw new Error(`Refusing to run tests against database "${config.DB_NAME}"; run them with npm test`);
  }
  const sequelize = createSequelize(config);
  try {
    await createMigrator(sequelize).up();
  } finally {
    await sequelize.close();
  }
}

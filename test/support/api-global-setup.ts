// Runs once before the API and end-to-end projects: brings the throw-away test database
// (started by scripts/test.sh) up to the latest migration.
import { loadConfig } from '../../server/config';
import { createSequelize } from '../../server/db';
import { createMigrator } from '../../server/db/migrator';
import { seedRuleSets } from '../../server/rule-sets/seed-rule-sets';

export default async function globalSetup(): Promise<void> {
  const config = loadConfig();
  if (config.DB_NAME !== 'torquetrail_test' && !process.env.ALLOW_NON_TEST_DB) {
    throw new Error(`Refusing to run tests against database "${config.DB_NAME}"; run them with npm test`);
  }
  const sequelize = createSequelize(config);
  try {
    await createMigrator(sequelize).up();
    // The shipped design standards are reference data every calc needs.
    await seedRuleSets(sequelize);
  } finally {
    await sequelize.close();
  }
}

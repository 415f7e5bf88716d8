// Runs once before the API and end-to-end projects: brings the throw-away test database
// (started by scripts/test.sh) up to the latest migration, and bundles the worker threads' code.
import { loadConfig } from '../../server/config';
import { createSequelize } from '../../server/db';
import { createMigrator } from '../../server/db/migrator';
import { seedRuleSets } from '../../server/rule-sets/seed-rule-sets';
import { bundleServer } from './bundle';

export default async function globalSetup(): Promise<void> {
  const config = loadConfig();
  if (config.DB_NAME !== 'torquetrail_test' && !process.env.ALLOW_NON_TEST_DB) {
    throw new Error(`Refusing to run tests against database "${config.DB_NAME}"; run them with npm test`);
  }
  // Every worker thread of every test app loads this one bundle instead of compiling the sources through tsx
  // (server/workers/work-pool.ts). Set here, before jest starts its workers, so they and their children inherit it.
  // heavy-work-entry.spec.ts runs the product's own entry (tsx) beside the bundle and compares their answers.
  process.env.HEAVY_WORK_BUNDLE = await bundleServer('server/workers/heavy-work.ts');
  const sequelize = createSequelize(config);
  try {
    await createMigrator(sequelize).up();
    // The shipped design standards are reference data every calc needs.
    await seedRuleSets(sequelize);
  } finally {
    await sequelize.close();
  }
}

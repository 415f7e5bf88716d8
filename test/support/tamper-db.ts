import { createMigrator } from '../../server/db/migrator';
import { seedRuleSets } from '../../server/rule-sets/seed-rule-sets';
import { startTestApp } from './api-harness';

/**
 * The database the audit-tampering specs work in. They drop the append-only triggers, hold the
 * chain head's lock and break the chain on purpose; in the shared test database every other suite
 * would queue behind them (and any chain check running meanwhile would see the break). scripts/test.sh
 * creates it beside the main one on the same throw-away server.
 */
export const TAMPER_DB_NAME = `${process.env.DB_NAME ?? 'torquetrail_test'}_tamper`;

/** A real app on the tampering database, migrated and seeded in `beforeAll` (registered here). */
export function tamperTestApp() {
  const ctx = startTestApp({ DB_NAME: TAMPER_DB_NAME });
  beforeAll(async () => {
    try {
      await createMigrator(ctx.sequelize).up();
    } catch (error) {
      throw new Error(
        `cannot prepare database ${TAMPER_DB_NAME} (scripts/test.sh creates it: ` +
          `db_ensure_schema ${TAMPER_DB_NAME} ${ctx.config.DB_USER} ...): ${(error as Error).message}`,
        { cause: error },
      );
    }
    // The shipped design standards are reference data every calc needs.
    await seedRuleSets(ctx.sequelize);
  });
  afterAll(() => ctx.close());
  return ctx;
}

// Command line: `tsx server/db/migrate.ts up|down|status`.
import { loadConfig } from '../config';
import { createSequelize } from '.';
import { createMigrator } from './migrator';

async function main(command = 'up'): Promise<void> {
  const sequelize = createSequelize(loadConfig());
  const migrator = createMigrator(sequelize);
  try {
    if (command === 'up') {
      const done = await migrator.up();
      console.log(`migrations applied: ${done.length ? done.map((m) => m.name).join(', ') : 'none pending'}`);
    } else if (command === 'down') {
      const undone = await migrator.down();
      console.log(`migrations reverted: ${undone.map((m) => m.name).join(', ') || 'none'}`);
    } else {
      const pending = await migrator.pending();
      console.log(`pending: ${pending.map((m) => m.name).join(', ') || 'none'}`);
    }
  } finally {
    await sequelize.close();
  }
}

main(process.argv[2]).catch((err) => {
  console.error(`migration failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});

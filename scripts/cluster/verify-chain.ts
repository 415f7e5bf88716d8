// Verifies the audit chain of the database named by the environment and prints the result as JSON.
// The cluster test runs it once per node, connected to that node directly.
import { loadConfig } from '../../server/config';
import { createSequelize } from '../../server/db';
import { verifyAuditChain } from '../../server/audit/audit.service';

async function main(): Promise<void> {
  const sequelize = createSequelize(loadConfig());
  try {
    await sequelize.query('SET SESSION wsrep_sync_wait = 15');
    console.log(JSON.stringify(await verifyAuditChain()));
  } finally {
    await sequelize.close();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});

// Loads the demo data once: `tsx server/db/seed.ts`. A database that already has users is left alone.
import { loadConfig } from '../config';
import { createSequelize } from '.';
import { Project, User, UserRole } from './models';
import { hashPassword } from '../auth/password';
import { appendAudit } from '../audit/audit.service';
import { DEMO_PASSWORD, DEMO_PROJECTS, DEMO_USERS } from './demo-data';
import { seedRuleSets } from '../rule-sets/seed-rule-sets';
import { seedDemoCalcs } from './demo/demo-calcs';
import { seedDemoReviewHealth } from './demo/demo-review-health';
import { AttachmentsService } from '../attachments/attachments.service';
import { ObjectStore } from '../attachments/object-store';

const SYSTEM = { id: null, name: 'demo data loader', ip: null };

function printAccounts(): void {
  console.log(`\nDemo accounts (password for all: ${DEMO_PASSWORD}):`);
  for (const u of DEMO_USERS)
    console.log(`  ${u.username.padEnd(11)} ${u.displayName.padEnd(18)} ${u.roles.join(' + ')}`);
  console.log('');
}

async function main(): Promise<void> {
  const sequelize = createSequelize(loadConfig());
  try {
    const standards = await seedRuleSets(sequelize);
    if (standards > 0) console.log(`design standards loaded from rules/: ${standards}`);
    if ((await User.count()) > 0) {
      console.log('demo data already present; nothing loaded');
      printAccounts();
      return;
    }
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    await sequelize.transaction(async (transaction) => {
      for (const u of DEMO_USERS) {
        const user = await User.create(
          { username: u.username, displayName: u.displayName, email: u.email, passwordHash },
          { transaction },
        );
        await UserRole.bulkCreate(
          u.roles.map((role) => ({ userId: user.id, role })),
          { transaction },
        );
        await appendAudit(
          sequelize,
          SYSTEM,
          { action: 'user.created', entityType: 'User', entityId: user.id, payload: { ...u } },
          transaction,
        );
      }
      for (const p of DEMO_PROJECTS) {
        const project = await Project.create({ ...p, createdBy: null }, { transaction });
        await appendAudit(
          sequelize,
          SYSTEM,
          { action: 'project.created', entityType: 'Project', entityId: project.id, payload: p },
          transaction,
        );
      }
    });
    const config = loadConfig();
    const attachments = new AttachmentsService(
      sequelize,
      new ObjectStore(config),
      config.ATTACHMENT_MAX_MB * 1024 * 1024,
    );
    const baseUrl = config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}`;
    await seedDemoCalcs(sequelize, baseUrl, attachments);
    await seedDemoReviewHealth(sequelize, baseUrl, attachments);
    console.log(
      `demo data loaded: ${DEMO_USERS.length} users, ${DEMO_PROJECTS.length} projects, calcs in every workflow state`,
    );
    printAccounts();
  } finally {
    await sequelize.close();
  }
}

main().catch((err) => {
  console.error(`loading demo data failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});

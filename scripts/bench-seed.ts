// Seeds the list benchmark's database (npm run bench): 200 people, 50 projects, 100,000 calcs,
// 300,000 revisions in every state with real results and checklists, their signatures and
// 1,000,000 chained audit entries. Bulk inserts through the driver's batch protocol; a data
// folder seeded once is reused by later runs (scripts/bench.sh keeps it unless BENCH_FRESH=1).
import { performance } from 'node:perf_hooks';
import mariadb from 'mariadb';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { createMigrator } from '../server/db/migrator';
import { RuleSetRecord } from '../server/db/models';
import { seedRuleSets } from '../server/rule-sets/seed-rule-sets';
import { registerEngineMetadata } from '../server/calcs/stored-result';
import { hashPassword } from '../server/auth/password';
import { BENCH, BENCH_PASSWORD, variantsOf } from './bench-seed-data';
import { peopleOf, projectsOf } from './bench-seed-names';
import { seedLibrary } from './bench-seed-library';
import { seedAudit } from './bench-seed-audit';

async function main(): Promise<void> {
  const config = loadConfig();
  const sequelize = createSequelize(config);
  await createMigrator(sequelize).up();
  await seedRuleSets(sequelize);
  await registerEngineMetadata(sequelize);
  const conn = await mariadb.createConnection({
    host: config.DB_HOST,
    port: config.DB_PORT,
    user: config.DB_USER,
    password: config.DB_PASSWORD,
    database: config.DB_NAME,
    timezone: 'Z',
    maxAllowedPacket: 64 * 1024 * 1024,
  });
  try {
    const [{ n }] = await conn.query('SELECT COUNT(*) AS n FROM calcs');
    if (Number(n) >= BENCH.calcs) {
      console.log(
        `Seed: reusing the seeded data folder (${Number(n).toLocaleString('en-US')} calcs); BENCH_FRESH=1 seeds anew`,
      );
      return;
    }
    const ruleSet = (await RuleSetRecord.findOne({
      where: { code: 'KFD-ENG-014', status: 'effective' },
      order: [['version', 'DESC']],
    }))!;
    const t0 = performance.now();
    const variants = await variantsOf(JSON.parse(ruleSet.document));
    const people = peopleOf(await hashPassword(BENCH_PASSWORD));
    const projects = projectsOf();
    await conn.batch(
      'INSERT INTO users (id, username, display_name, email, password_hash, active, version, created_at, updated_at) VALUES (?, ?, ?, ?, ?, 1, 0, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))',
      people.map((p) => [p.id, p.username, p.displayName, `${p.username}@kestrel-fen.example`, p.hash]),
    );
    await conn.batch(
      'INSERT INTO user_roles (user_id, role) VALUES (?, ?)',
      people.flatMap((p) => p.roles.map((r) => [p.id, r])),
    );
    await conn.batch(
      "INSERT INTO projects (id, code, name, client, description, revision_scheme, status, version, created_at, updated_at) VALUES (?, ?, ?, ?, ?, 'letters', 'active', 0, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))",
      projects.map((p) => [p.id, p.code, p.name, p.client, p.description]),
    );
    const t1 = performance.now();
    const library = await seedLibrary(conn, { people, projects, variants, ruleSet });
    const t2 = performance.now();
    const audited = await seedAudit(conn, { people, library });
    const t3 = performance.now();
    await conn.query('ANALYZE TABLE calcs, revisions, audit_events, signatures, calc_editors');
    console.log(
      `Seed: ${people.length} people, ${projects.length} projects, ${library.calcs.toLocaleString('en-US')} calcs, ${library.revisions.toLocaleString('en-US')} revisions, ${library.signatures.toLocaleString('en-US')} signatures, ${audited.toLocaleString('en-US')} audit entries`,
    );
    console.log(
      `  seeding time: set-up ${((t1 - t0) / 1000).toFixed(1)} s, calcs and revisions ${((t2 - t1) / 1000).toFixed(1)} s, audit ${((t3 - t2) / 1000).toFixed(1)} s, total ${((performance.now() - t0) / 1000).toFixed(1)} s`,
    );
  } finally {
    await conn.end();
    await sequelize.close();
  }
}

main().catch((err) => {
  console.error(
    `bench seed failed: ${(err instanceof Error ? (err.stack ?? err.message) : String(err)).slice(0, 1200)}`,
  );
  process.exit(1);
});

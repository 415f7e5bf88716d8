// Review-health endpoint latency (npm run bench, issue 15): the library seeded at a tenth (10,000 calcs),
// plus findings, refusals and changed attachment sets (bench-health-seed.ts) and a stricter standard version
// in force today. Prints the first answer (which counts sizes and re-evaluates approvals once) and then
// p50/p95/p99/max of repeated answers. Nothing here is a test and nothing asserts a figure.
import { cpus, loadavg } from 'node:os';
import mariadb from 'mariadb';
import { QueryTypes } from 'sequelize';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { BENCH_AUDITOR_SQL, BENCH_PASSWORD } from './bench-seed-data';
import { signIn, startServer } from './bench-http';
import { seedHealthMaterial } from './bench-health-seed';
import { replaceStandardForBench } from './bench-health-standard';
import { cpuMs, cpuPer, phaseMedians, pidFromFile, spread, timed, type Answer } from './bench-health-timing';
import { backfillReviewFacts } from '../server/review-health/review-facts';

// Enough answers for a p99 that is not simply the slowest one.
const REPEATS = Number(process.env.BENCH_HEALTH_REPEATS ?? 100);

async function main(): Promise<void> {
  const config = loadConfig();
  const conn = await mariadb.createConnection({
    host: config.DB_HOST,
    port: config.DB_PORT,
    user: config.DB_USER,
    password: config.DB_PASSWORD,
    database: config.DB_NAME,
    timezone: 'Z',
  });
  const sequelize = createSequelize(config);
  // The database's own CPU time per answer, when it runs on this machine (scripts/lib.sh db_start).
  const dbPid = pidFromFile(((await conn.query('SELECT @@pid_file AS f')) as { f: string }[])[0].f);
  try {
    if (await seedHealthMaterial(conn)) await backfillReviewFacts(sequelize);
    await replaceStandardForBench(conn);
    await conn.query('ANALYZE TABLE revisions, signatures, findings, audit_events');
  } finally {
    await conn.end();
  }
  const count = async (sql: string) =>
    Number((await sequelize.query<{ n: number }>(sql, { type: QueryTypes.SELECT }))[0].n);
  const [calcs, signatures, findings] = [
    await count('SELECT COUNT(*) AS n FROM calcs'),
    await count('SELECT COUNT(*) AS n FROM signatures'),
    await count('SELECT COUNT(*) AS n FROM findings'),
  ];
  const [auditor] = await sequelize.query<{ username: string }>(BENCH_AUDITOR_SQL, { type: QueryTypes.SELECT });
  const [project] = await sequelize.query<{ id: number }>(
    "SELECT id FROM projects WHERE code LIKE 'KFD-B%' ORDER BY id LIMIT 1",
    { type: QueryTypes.SELECT },
  );
  await sequelize.close();
  const server = await startServer({
    LOG_LEVEL: 'silent',
    MAIL_SENDER: 'false',
    LOGIN_RATE_LIMIT: '10000',
    NODE_ENV: 'production',
    TLS: 'false',
    // The bench prints each signal's phase (off by default, server/config.ts).
    SERVER_TIMING_PHASES: 'true',
  });
  try {
    const session = await signIn(server.url, auditor.username, BENCH_PASSWORD);
    const today = new Date().toISOString().slice(0, 10);
    const tenYears = new Date(Date.now() - 3650 * 86_400_000).toISOString().slice(0, 10);
    const oneYear = new Date(Date.now() - 365 * 86_400_000).toISOString().slice(0, 10);
    console.log(
      `Review health · load average ${loadavg()
        .map((n) => n.toFixed(1))
        .join(' / ')} (1 / 5 / 15 min) on ${cpus().length} cores`,
    );
    console.log(
      `Review health · ${calcs.toLocaleString('en-US')} calcs, ${signatures.toLocaleString('en-US')} signatures, ${findings.toLocaleString('en-US')} findings (target: < 500 ms)`,
    );
    for (const [name, path] of [
      ['all projects, ten years', `/api/review-health?from=${tenYears}&to=${today}`],
      ['all projects, one year', `/api/review-health?from=${oneYear}&to=${today}`],
      ['one project, ten years', `/api/review-health?projectId=${project.id}&from=${tenYears}&to=${today}`],
      ['one project, one year', `/api/review-health?projectId=${project.id}&from=${oneYear}&to=${today}`],
    ] as const) {
      const first = await timed(server.url + path, session.cookie);
      const runs: Answer[] = [];
      const [app0, db0] = [cpuMs(server.child.pid!), cpuMs(dbPid)];
      for (let i = 0; i < REPEATS; i++) runs.push(await timed(server.url + path, session.cookie));
      const [app, db] = [cpuPer(app0, cpuMs(server.child.pid!), REPEATS), cpuPer(db0, cpuMs(dbPid), REPEATS)];
      // The service's own time (elapsedMs) beside the whole answer: the rest is JSON, HTTP and the event loop.
      const service = spread(runs.map((r) => r.serverMs ?? NaN)).split(',')[0];
      console.log(
        `  ${name.padEnd(26)} first ${first.ms.toFixed(0)} ms (status ${first.status}); then ${spread(runs.map((r) => r.ms))} over ${REPEATS} (service ${service}; CPU per answer: server ${app}, database ${db}; ${(first.bytes / 1024).toFixed(0)} kB; load ${loadavg()[0].toFixed(1)})`,
      );
      console.log(`    phases p50 (ms, phases run side by side): ${phaseMedians(runs)}`);
    }
  } finally {
    server.child.kill();
  }
}

main().catch((err) => {
  console.error(`review-health bench failed: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
  process.exit(1);
});

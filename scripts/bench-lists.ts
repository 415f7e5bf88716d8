// List, read and save figures over the seeded library (npm run bench): each endpoint under 32
// concurrent connections, then 20 writers saving their own drafts, then the audit chain head's
// ceiling. Prints p50/p95/p99 and req/s; nothing here is a test and nothing asserts a figure.
import { cpus, loadavg } from 'node:os';
import { QueryTypes } from 'sequelize';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { BENCH_AUDITOR_SQL, BENCH_PASSWORD, BENCH_WORKER_SQL } from './bench-seed-data';
import { join } from 'node:path';
import { line, load, msText, signIn, startServer, type Session } from './bench-http';
import { endpointsOf } from './bench-lists-endpoints';
import { chainCeiling, cpuSeconds, databasePid, dbStatus, saves } from './bench-writes';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
/**
 * 32 is the target's; on a machine shared with other work a smaller BENCH_CONNECTIONS keeps one
 * endpoint's backlog of unanswered requests out of the next endpoint's figures.
 */
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 32);
const ALONE_SECONDS = Number(process.env.BENCH_ALONE_SECONDS ?? 5);
/**
 * Every line's requests run this long at full load, unmeasured, before the first line is measured (0: none). A server
 * that has just started runs its code unoptimised and reads pages MariaDB has not cached yet: on 5 December 2026 a
 * project's calc list took 1.29 ms of the app's CPU an answer in its first 8 s at 32 connections and 0.88 ms after,
 * and the first list line read p95 56–64 ms where the next three read 41–44. The targets are for a server in service.
 */
const WARM_UP_SECONDS = Number(process.env.BENCH_WARM_UP_SECONDS ?? 3);
/**
 * App instances sharing the connections (BENCH_APPS=2: one per core of this machine, as README "Scaling out" advises).
 * One by default, so that the figures compare with every earlier run (DEVELOPERS.md, "Measuring speed").
 */
const APPS = Math.max(1, Math.trunc(Number(process.env.BENCH_APPS ?? 1)) || 1);
/** BENCH_ONLY=search runs only the endpoints whose name matches (and the saves only if it matches "saves"). */
const ONLY = process.env.BENCH_ONLY ? new RegExp(process.env.BENCH_ONLY, 'i') : null;
/**
 * Not the product: node:http answering at once, then after one `SELECT 1` through the MariaDB driver's pool
 * (scripts/bench-floor-server.ts). What any answer costs on this machine before the app does anything.
 */
const FLOORS: [string, string][] = [
  ['for scale · node:http alone, no framework', '/no-db'],
  ['for scale · node:http + SELECT 1, no framework', '/'],
];

async function main(): Promise<void> {
  const sequelize = createSequelize(loadConfig());
  const q = <T extends object>(sql: string) => sequelize.query<T>(sql, { type: QueryTypes.SELECT });
  const projects = (await q<{ id: number }>("SELECT id FROM projects WHERE code LIKE 'KFD-B%' ORDER BY id")).map(
    (p) => p.id,
  );
  const revisions = (
    await q<{ id: number }>(
      "SELECT latest_revision_id AS id FROM calcs WHERE latest_status = 'approved' ORDER BY id DESC LIMIT 500",
    )
  ).map((r) => r.id);
  const [dual] = await q<{ username: string }>(BENCH_WORKER_SQL);
  const [auditor] = await q<{ username: string; id: number }>(BENCH_AUDITOR_SQL);
  const dbPid = await databasePid(sequelize);
  const env = {
    LOG_LEVEL: 'silent',
    MAIL_SENDER: 'false',
    LOGIN_RATE_LIMIT: '10000',
    NODE_ENV: 'production',
    TLS: 'false',
  };
  const servers = await Promise.all(Array.from({ length: APPS }, () => startServer(env)));
  const [server] = servers;
  const urls = servers.map((s) => s.url);
  // The app's CPU is every instance's together.
  const appCpu = () => servers.reduce((sum, s) => sum + cpuSeconds(s.child.pid), 0);
  try {
    // Sessions live in the database, so one signed in on the first instance is signed in on every other.
    const compliance = await signIn(server.url, auditor.username, BENCH_PASSWORD);
    const worker = await signIn(server.url, dual.username, BENCH_PASSWORD);
    // Only the list endpoints need a deep page's cursor: BENCH_ONLY=saves skips walking there.
    const deep = ONLY && !ONLY.test('keyset') ? '' : await deepCursor(server.url, compliance.cookie, projects[7]);
    const endpoints = endpointsOf({ compliance, worker, auditorId: auditor.id, projects, revisions, deep }).filter(
      ([name]) => !ONLY || ONLY.test(name),
    );
    /**
     * One line: alone, then under load; with the CPU each answer took in the server (`cpu`, its process or processes),
     * in MariaDB and in this process (the load generator), and the statements sent per answer.
     */
    const measure = async (
      name: string,
      session: Session,
      paths: string[],
      target: { url: string; urls: string[]; cpu: () => number },
    ): Promise<void> => {
      const alone = await load(target.url, session, paths, 1, ALONE_SECONDS);
      const cpuBefore = target.cpu();
      const dbBefore = cpuSeconds(dbPid);
      const clientBefore = process.cpuUsage();
      const statusBefore = await dbStatus(sequelize);
      const busy = await load(target.urls, session, paths, CONNECTIONS, SECONDS);
      // Statements the app sent per answer (the session's look-up included), each a round trip and a parse.
      const statements = ((await dbStatus(sequelize)).Questions - statusBefore.Questions - 1) / busy.requests;
      // The app process's CPU per answer moves far less with other jobs' load than the wall-clock figures; MariaDB's
      // (its whole process, so other clients of the same server count too) says what the statements cost, and the load
      // generator's (this process: autocannon's requests and reading the answers) what the two cores lose to it.
      const cpu = ((target.cpu() - cpuBefore) * 1000) / busy.requests;
      const dbCpu = ((cpuSeconds(dbPid) - dbBefore) * 1000) / busy.requests;
      const client = process.cpuUsage(clientBefore);
      const clientCpu = (client.user + client.system) / 1000 / busy.requests;
      console.log(
        `${line(name, busy).replace(name.padEnd(46), `${name.padEnd(46)} ${msText(alone.p50)}`)}  ${loadavg()[0].toFixed(1)}  app CPU ${cpu.toFixed(2)} ms, MariaDB ${dbCpu.toFixed(2)} ms, load generator ${clientCpu.toFixed(2)} ms, statements ${statements.toFixed(1)}${alone.errors ? `  (alone: ${alone.errors} failed or timed out)` : ''}`,
      );
    };
    console.log(
      `Lists and reads · alone (1 connection, ${ALONE_SECONDS} s) then ${CONNECTIONS} concurrent connections (${SECONDS} s) · ${APPS === 1 ? 'one app process' : `${APPS} app processes`} (DB_POOL_MAX ${process.env.DB_POOL_MAX ?? 10}) · ${cpus().length} cores`,
    );
    // Other jobs on the machine change every figure; the 1-minute load average is printed beside each.
    console.log(
      `  ${'endpoint'.padEnd(46)} ${'alone p50'.padStart(10)} ${'p50'.padStart(10)} ${'p95'.padStart(10)} ${'p99'.padStart(10)} ${'rate'.padStart(13)}  load`,
    );
    // The machine's own floor first: what the load generator, node:http and one statement cost here, no framework.
    const floors = FLOORS.filter(([name]) => !ONLY || ONLY.test(name));
    if (floors.length) {
      const floor = await startServer(env, join(__dirname, 'bench-floor-server.ts'));
      try {
        const target = { url: floor.url, urls: [floor.url], cpu: () => cpuSeconds(floor.child.pid) };
        for (const [name, path] of floors) await measure(name, { cookie: '', csrf: '' }, [path], target);
      } finally {
        floor.child.kill('SIGTERM');
      }
    }
    if (WARM_UP_SECONDS > 0 && endpoints.length) {
      for (const [, session, paths] of endpoints) await load(urls, session, paths, CONNECTIONS, WARM_UP_SECONDS);
      console.log(
        `  (every line below first ran ${WARM_UP_SECONDS} s at full load, unmeasured: BENCH_WARM_UP_SECONDS)`,
      );
    }
    for (const [name, session, paths] of endpoints)
      await measure(name, session, paths, { url: server.url, urls, cpu: appCpu });
    console.log('  targets: p95 ≤ 50 ms each (32 concurrent), every line but the first three ("for scale")');
    if (!ONLY || ONLY.test('saves')) await saves(urls, sequelize, SECONDS, appCpu, WARM_UP_SECONDS);
  } finally {
    for (const s of servers) s.child.kill('SIGTERM');
  }
  if (!ONLY || ONLY.test('saves')) await chainCeiling(sequelize, SECONDS);
  await sequelize.close();
}

/** The cursor of page 20 of a project's list, found by walking it once. */
async function deepCursor(url: string, cookie: string, projectId: number): Promise<string> {
  let after = '';
  for (let page = 0; page < 19; page++) {
    const res = await fetch(`${url}/api/calcs?projectId=${projectId}&size=50${after ? `&after=${after}` : ''}`, {
      headers: { cookie },
    });
    const body = (await res.json()) as { next: string | null };
    if (!body.next) break;
    after = body.next;
  }
  return after;
}

main().catch((err) => {
  console.error(
    `list benchmark failed: ${(err instanceof Error ? (err.stack ?? err.message) : String(err)).slice(0, 1200)}`,
  );
  process.exit(1);
});

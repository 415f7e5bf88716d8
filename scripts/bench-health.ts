// Review-health endpoint latency (npm run bench, issue 15): the library seeded at a tenth (10,000 calcs),
// plus findings, refusals and changed attachment sets (bench-health-seed.ts) and a stricter standard version
// in force today. Prints the first answer (which counts sizes and re-evaluates approvals once) and then
// p50/p95/max of repeated answers. Nothing here is a test and nothing asserts a figure.
import { readFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import mariadb from 'mariadb';
import { QueryTypes } from 'sequelize';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { BENCH_PASSWORD } from './bench-seed-data';
import { signIn, startServer } from './bench-http';
import { seedHealthMaterial } from './bench-health-seed';
import { replaceStandardForBench } from './bench-health-standard';
import { backfillReviewFacts } from '../server/review-health/review-facts';

const REPEATS = Number(process.env.BENCH_HEALTH_REPEATS ?? 15);

async function timed(
  url: string,
  cookie: string,
): Promise<{ ms: number; status: number; serverMs: number | null; bytes: number; phases: Map<string, number> }> {
  const t0 = performance.now();
  const res = await fetch(url, { headers: { cookie } });
  const text = await res.text();
  const body = JSON.parse(text) as { elapsedMs?: number };
  // Server-Timing: `name;dur=12.3` per phase of the answer (server/http/server-timing.ts).
  const phases = new Map(
    (res.headers.get('server-timing') ?? '')
      .split(',')
      .map((p) => p.trim().match(/^([\w-]+);dur=([\d.]+)$/))
      .filter((m) => m !== null)
      .map((m) => [m[1], Number(m[2])] as const),
  );
  return {
    ms: performance.now() - t0,
    status: res.status,
    serverMs: body.elapsedMs ?? null,
    bytes: text.length,
    phases,
  };
}

/** CPU time the server process has used (user + system, ms): steadier than wall time on a shared machine. */
function cpuMs(pid: number): number {
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / 100;
}

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
  const [auditor] = await sequelize.query<{ username: string }>(
    "SELECT u.username FROM users u JOIN user_roles r ON r.user_id = u.id AND r.role = 'compliance' WHERE u.username LIKE 'kfd-%' LIMIT 1",
    { type: QueryTypes.SELECT },
  );
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
      const runs: { ms: number; serverMs: number | null; phases: Map<string, number> }[] = [];
      const cpu0 = cpuMs(server.child.pid!);
      for (let i = 0; i < REPEATS; i++) runs.push(await timed(server.url + path, session.cookie));
      const cpuPer = (cpuMs(server.child.pid!) - cpu0) / REPEATS;
      const pct = (values: number[], p: number) =>
        [...values].sort((a, b) => a - b)[Math.min(values.length - 1, Math.floor(p * values.length))].toFixed(0);
      const times = runs.map((r) => r.ms);
      // The service's own time (elapsedMs) beside the whole answer: the rest is JSON, HTTP and the event loop.
      const service = runs.map((r) => r.serverMs ?? NaN);
      console.log(
        `  ${name.padEnd(26)} first ${first.ms.toFixed(0)} ms (status ${first.status}); then p50 ${pct(times, 0.5)} ms, p95 ${pct(times, 0.95)} ms, max ${pct(times, 1)} ms over ${REPEATS} (service p50 ${pct(service, 0.5)} ms; server CPU ${cpuPer.toFixed(0)} ms and ${(first.bytes / 1024).toFixed(0)} kB per answer; load ${loadavg()[0].toFixed(1)})`,
      );
      const names = [...runs[0].phases.keys()].filter((k) => k !== 'app');
      console.log(
        `    phases p50 (ms, phases run side by side): ${names
          .map(
            (k) =>
              `${k} ${pct(
                runs.map((r) => r.phases.get(k) ?? 0),
                0.5,
              )}`,
          )
          .join(', ')}`,
      );
    }
  } finally {
    server.child.kill();
  }
}

main().catch((err) => {
  console.error(`review-health bench failed: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
  process.exit(1);
});

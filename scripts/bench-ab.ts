// Two versions of the app compared on the list bench's library (npm run bench:ab -- <other checkout> [path …]): a
// server from each checkout, both on the same database, and the load alternated between them in short slices, so that
// the machine's own changes of speed (by half within an hour on the 2-core machine) fall on both alike. Prints the
// app's CPU per answer for each, which two separate runs cannot compare below 10-20 %; figures only, nothing asserts.
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { QueryTypes } from 'sequelize';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { BENCH_AUDITOR_SQL, BENCH_PASSWORD, BENCH_WORKER_SQL } from './bench-seed-data';
import { figuresOf, load, signIn, startServer } from './bench-http';
import { cpuSeconds, saveFor, writersOf } from './bench-writes';

const SLICES = Number(process.env.BENCH_AB_SLICES ?? 6);
const SLICE_SECONDS = Number(process.env.BENCH_AB_SECONDS ?? 3);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 32);
/** Not a path: the list bench's twenty writers saving their own drafts (scripts/bench-writes.ts), alternated alike. */
const SAVES = 'saves';

function usage(problem: string): never {
  console.error(`bench:ab: ${problem}`);
  console.error(
    'usage: npm run bench:ab -- <other checkout> [API path or "saves" …]   (this checkout is B, the other A)',
  );
  process.exit(2);
}

async function main(): Promise<void> {
  const [other, ...asked] = process.argv.slice(2);
  if (!other) usage('name the other checkout to compare with');
  const checkouts = [resolve(other), resolve(__dirname, '..')];
  for (const dir of checkouts) {
    if (!existsSync(join(dir, 'server', 'main.ts'))) usage(`${dir} is not a Torquetrail checkout (no server/main.ts)`);
    if (!existsSync(join(dir, 'node_modules'))) usage(`${dir} has no node_modules (npm ci there, or link this one's)`);
  }
  if (asked.some((p) => !p.startsWith('/api/') && p !== SAVES)) usage(`each path starts with /api/, or is "${SAVES}"`);
  const sequelize = createSequelize(loadConfig());
  const q = <T extends object>(sql: string) => sequelize.query<T>(sql, { type: QueryTypes.SELECT });
  // BENCH_AB_AS=worker signs in as the list bench's author and checker (whose queues are full), else compliance.
  const [person] = await q<{ username: string }>(
    process.env.BENCH_AB_AS === 'worker' ? BENCH_WORKER_SQL : BENCH_AUDITOR_SQL,
  );
  const [project] = await q<{ id: number }>("SELECT id FROM projects WHERE code LIKE 'KFD-B%' ORDER BY id LIMIT 1");
  const [revision] = await q<{ id: number }>(
    "SELECT latest_revision_id AS id FROM calcs WHERE latest_status = 'approved' ORDER BY id DESC LIMIT 1",
  );
  if (!person || !project || !revision) usage('the library is not seeded here: run npm run bench once first');
  const paths = asked.length
    ? asked
    : [
        '/api/session',
        `/api/calcs?projectId=${project.id}&size=50`,
        '/api/calcs?q=shaft&size=50',
        '/api/audit?size=50',
        `/api/revisions/${revision.id}`,
        '/api/projects?size=50',
        '/api/rule-sets',
        SAVES,
      ];
  const env = { LOG_LEVEL: 'silent', MAIL_SENDER: 'false', LOGIN_RATE_LIMIT: '10000', NODE_ENV: 'production' };
  const servers = await Promise.all(checkouts.map((dir) => startServer(env, join(dir, 'server', 'main.ts'))));
  try {
    const sessions = await Promise.all(servers.map((s) => signIn(s.url, person.username, BENCH_PASSWORD)));
    const writers = paths.includes(SAVES) ? await writersOf(servers[0].url, sequelize) : undefined;
    console.log(
      `A ${checkouts[0]} against B ${checkouts[1]} · ${CONNECTIONS} connections · ${SLICES} slices of ${SLICE_SECONDS} s each, alternated`,
    );
    for (const path of paths) {
      const sides = servers.map(() => ({ cpu: 0, answers: 0, failed: 0, p95: [] as number[] }));
      for (let k = 0; k < SLICES; k++) {
        // Each slice pair in the other order from the last, so neither side always runs second.
        for (const i of k % 2 ? [1, 0] : [0, 1]) {
          const before = cpuSeconds(servers[i].child.pid!);
          const figures =
            path === SAVES && writers
              ? await saveFor(writers, [servers[i].url], SLICE_SECONDS).then((r) =>
                  figuresOf(r.latencies, SLICE_SECONDS, r.failures),
                )
              : await load(servers[i].url, sessions[i], [path], CONNECTIONS, SLICE_SECONDS);
          sides[i].cpu += cpuSeconds(servers[i].child.pid!) - before;
          sides[i].answers += figures.requests;
          sides[i].failed += figures.errors;
          sides[i].p95.push(figures.p95);
        }
      }
      const text = sides.map((s, i) => {
        const p95 = [...s.p95].sort((a, b) => a - b)[Math.floor(s.p95.length / 2)];
        const cpu = s.answers ? `${((s.cpu * 1000) / s.answers).toFixed(3)} ms` : 'no answer';
        return `${'AB'[i]} ${cpu} CPU/answer, ${(s.answers / (SLICES * SLICE_SECONDS)).toFixed(0)}/s, p95 ${p95.toFixed(1)} ms${s.failed ? ` (${s.failed} failed)` : ''}`;
      });
      console.log(`  ${path.slice(0, 44).padEnd(44)} ${text.join('  |  ')}`);
    }
  } finally {
    for (const s of servers) s.child.kill('SIGTERM');
    await sequelize.close();
  }
}

main().catch((err) => {
  console.error(`bench:ab failed: ${(err instanceof Error ? (err.stack ?? err.message) : String(err)).slice(0, 1200)}`);
  process.exit(1);
});

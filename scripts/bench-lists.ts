// List, read and save figures over the seeded library (npm run bench): each endpoint under 32
// concurrent connections, then 20 writers saving their own drafts, then the audit chain head's
// ceiling. Prints p50/p95/p99 and req/s; nothing here is a test and nothing asserts a figure.
import { cpus, loadavg } from 'node:os';
import { QueryTypes } from 'sequelize';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { BENCH_PASSWORD } from './bench-seed-data';
import { line, load, signIn, startServer } from './bench-http';
import { chainCeiling, saves } from './bench-writes';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = 32;

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
  const [dual] = await q<{ username: string }>(
    "SELECT u.username FROM users u JOIN user_roles a ON a.user_id = u.id AND a.role = 'author' JOIN user_roles c ON c.user_id = u.id AND c.role = 'checker' WHERE u.username LIKE 'kfd-%' LIMIT 1",
  );
  const [auditor] = await q<{ username: string; id: number }>(
    "SELECT u.username, u.id FROM users u JOIN user_roles r ON r.user_id = u.id AND r.role = 'compliance' WHERE u.username LIKE 'kfd-%' LIMIT 1",
  );
  const server = await startServer({
    LOG_LEVEL: 'silent',
    MAIL_SENDER: 'false',
    LOGIN_RATE_LIMIT: '10000',
    NODE_ENV: 'production',
    TLS: 'false',
  });
  try {
    const compliance = await signIn(server.url, auditor.username, BENCH_PASSWORD);
    const worker = await signIn(server.url, dual.username, BENCH_PASSWORD);
    const deep = await deepCursor(server.url, compliance.cookie, projects[7]);
    const p = (i: number) => projects[i % projects.length];
    const endpoints: [string, typeof compliance, string[]][] = [
      ['calc list · project, newest first', compliance, projects.map((id) => `/api/calcs?projectId=${id}&size=50`)],
      [
        'calc list · project + state, by number',
        compliance,
        projects.map(
          (id, i) =>
            `/api/calcs?projectId=${id}&status=${['approved', 'draft', 'in_check'][i % 3]}&sort=number&dir=asc&size=50`,
        ),
      ],
      [
        'calc list · whole library, by title',
        compliance,
        ['asc', 'desc'].map((d) => `/api/calcs?sort=title&dir=${d}&size=50`),
      ],
      [
        'calc list · 20th page by keyset',
        compliance,
        [`/api/calcs?projectId=${projects[7]}&size=50${deep ? `&after=${deep}` : ''}`],
      ],
      [
        'search box (number, title, part, author…)',
        compliance,
        ['Ashdown', 'pulley', `KFD-B${String(3).padStart(2, '0')}-0000`, 'DRG-4', 'mixer agitator', 'Returned'].map(
          (w) => `/api/calcs?q=${encodeURIComponent(w)}&size=50`,
        ),
      ],
      ['queues (author + checker)', worker, ['/api/dashboard/queues']],
      ['projects', compliance, ['/api/projects?size=50']],
      ['audit list · newest', compliance, ['/api/audit?size=50']],
      [
        'audit list · by project / calc / person',
        compliance,
        projects
          .slice(0, 10)
          .flatMap((id, i) => [
            `/api/audit?projectId=${id}&size=50`,
            `/api/audit?userId=${auditor.id + i}&size=50`,
            `/api/audit?action=revision.signed&projectId=${p(i + 3)}&size=50`,
          ]),
      ],
      ['standards library', compliance, ['/api/rule-sets']],
      ['one revision with results and checklist', compliance, revisions.map((id) => `/api/revisions/${id}`)],
    ];
    console.log(
      `Lists and reads · ${CONNECTIONS} concurrent connections · ${SECONDS} s each · one app process (DB_POOL_MAX ${process.env.DB_POOL_MAX ?? 10})`,
    );
    // Other jobs on the machine change every figure; the load average says how busy it was.
    console.log(
      `  load average before the runs: ${loadavg()
        .map((l) => l.toFixed(1))
        .join(' / ')} on ${cpus().length} cores`,
    );
    console.log(
      `  ${'endpoint'.padEnd(46)} ${'p50'.padStart(10)} ${'p95'.padStart(10)} ${'p99'.padStart(10)} ${'rate'.padStart(13)}`,
    );
    for (const [name, session, paths] of endpoints)
      console.log(line(name, await load(server.url, session, paths, CONNECTIONS, SECONDS)));
    console.log('  targets: p95 ≤ 50 ms each');
    await saves(server.url, sequelize, SECONDS);
  } finally {
    server.child.kill('SIGTERM');
  }
  await chainCeiling(sequelize, SECONDS);
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

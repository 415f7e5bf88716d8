// Write figures of the list benchmark: concurrent saves through the API, and the audit chain head's ceiling.
import { existsSync, readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { QueryTypes, type Sequelize } from 'sequelize';
import { appendAudit } from '../server/audit/audit.service';
import { BENCH_PASSWORD } from './bench-seed-data';
import { figuresOf, line, signIn, type Session } from './bench-http';
import { REVISION_FORM_HEADER, STORED_FORM } from '../shared/schemas/revision-form';

const WRITERS = 20;

interface Draft {
  username: string;
  revisionId: number;
  lockVersion: number;
  input: string;
}

/** The bench's writers: twenty authors, each with a draft of their own and a signed-in session (valid everywhere). */
export interface Writers {
  drafts: Draft[];
  sessions: Session[];
  /** Each draft's lock version as last saved, carried from one run of saves to the next. */
  lockVersions: number[];
}

export async function writersOf(url: string, sequelize: Sequelize): Promise<Writers> {
  const drafts = await sequelize.query<Draft>(
    `SELECT u.username, r.id AS revisionId, r.lock_version AS lockVersion, r.input FROM users u
     JOIN calcs c ON c.id = (SELECT c2.id FROM calcs c2 WHERE c2.latest_author_id = u.id AND c2.latest_status = 'draft' ORDER BY c2.id LIMIT 1)
     JOIN revisions r ON r.id = c.latest_revision_id WHERE u.username LIKE 'kfd-%' ORDER BY u.id LIMIT ${WRITERS}`,
    { type: QueryTypes.SELECT },
  );
  // Sessions live in the database, so one signed in on the first instance is signed in on every other.
  const sessions = await Promise.all(drafts.map((d) => signIn(url, d.username, BENCH_PASSWORD)));
  return { drafts, sessions, lockVersions: drafts.map((d) => d.lockVersion) };
}

/** Every writer saves its draft as fast as the server answers, for `seconds`, shared out among `urls`. */
export async function saveFor(
  writers: Writers,
  urls: string[],
  seconds: number,
): Promise<{ latencies: number[]; phases: Map<string, number[]>; failures: number }> {
  const urlOf = (w: number) => urls[w % urls.length];
  const latencies: number[] = [];
  const phases = new Map<string, number[]>();
  let failures = 0;
  const until = performance.now() + seconds * 1000;
  await Promise.all(
    writers.drafts.map(async (draft, w) => {
      const input = JSON.parse(draft.input);
      for (let n = 0; performance.now() < until; n++) {
        // Each save changes the body diameter a little, so the engine and the diff have real work.
        input.segments[3].od = 60 + (n % 5);
        const t0 = performance.now();
        const res = await fetch(`${urlOf(w)}/api/revisions/${draft.revisionId}`, {
          method: 'PUT',
          // As the browser saves: the answer's result and checklist as stored (shared/schemas/revision-form.ts).
          headers: {
            'content-type': 'application/json',
            cookie: writers.sessions[w].cookie,
            'x-csrf-token': writers.sessions[w].csrf,
            [REVISION_FORM_HEADER]: STORED_FORM,
          },
          body: JSON.stringify({ input, lockVersion: writers.lockVersions[w] }),
        });
        const body = (await res.json()) as { lockVersion?: number };
        if (res.status === 200 && body.lockVersion != null) {
          latencies.push(performance.now() - t0);
          collectPhases(phases, res.headers.get('server-timing'));
          writers.lockVersions[w] = body.lockVersion;
        } else {
          // The first refusal says why (a 409 from an earlier run's lock version, a 503 …); the rest are counted.
          if (failures++ === 0) console.log(`  first refused: ${res.status} ${JSON.stringify(body).slice(0, 200)}`);
        }
      }
    }),
  );
  return { latencies, phases, failures };
}

/**
 * Twenty authors each save their own draft as fast as the server answers, for `seconds`, shared out among the app
 * instances at `urls`; `appCpu` reads their CPU seconds together.
 */
export async function saves(
  urls: string[],
  sequelize: Sequelize,
  seconds: number,
  appCpu: () => number,
  warmUpSeconds = 0,
): Promise<void> {
  const writers = await writersOf(urls[0], sequelize);
  const { drafts } = writers;
  // Unmeasured saves first, as the list lines have their warm-up (bench-lists.ts, BENCH_WARM_UP_SECONDS).
  if (warmUpSeconds > 0) await saveFor(writers, urls, warmUpSeconds);
  const dbPid = await databasePid(sequelize);
  const cpuBefore = appCpu();
  const dbBefore = { cpu: cpuSeconds(dbPid), status: await dbStatus(sequelize) };
  const { latencies, phases, failures } = await saveFor(writers, urls, seconds);
  console.log(
    `Saves · ${drafts.length} writers on their own drafts · ${seconds} s (engine, checklist, diff, hash, audit entry, answer)${warmUpSeconds > 0 ? ` after ${warmUpSeconds} s unmeasured` : ''}`,
  );
  console.log(line('PUT /api/revisions/:id', figuresOf(latencies, seconds, failures)));
  console.log('  target: ≥ 150 saves/s with p95 ≤ 150 ms');
  printPhases(phases);
  // CPU seconds hardly move with other jobs' load, so they compare two versions better than wall-clock figures.
  const cpu = appCpu() - cpuBefore;
  const dbCpu = cpuSeconds(dbPid) - dbBefore.cpu;
  const status = await dbStatus(sequelize);
  const per = (name: string) => ((status[name] - dbBefore.status[name]) / latencies.length).toFixed(1);
  const ms = (seconds: number) => ((seconds * 1000) / latencies.length).toFixed(1);
  if (!latencies.length) return;
  console.log(`  CPU per save: app process ${ms(cpu)} ms, MariaDB ${ms(dbCpu)} ms`);
  // Sent by the app (Questions: not the statements a procedure runs inside), bytes both ways, per save (refused too).
  console.log(
    `  per save: statements ${per('Questions')}, bytes to MariaDB ${per('Bytes_received')}, ` +
      `from it ${per('Bytes_sent')}`,
  );
}

/** MariaDB's own counters (statements the clients sent, bytes both ways), from its global status. */
export async function dbStatus(sequelize: Sequelize): Promise<Record<string, number>> {
  const rows = await sequelize.query<{ Variable_name: string; Value: string }>(
    "SHOW GLOBAL STATUS WHERE Variable_name IN ('Questions', 'Bytes_received', 'Bytes_sent')",
    { type: QueryTypes.SELECT },
  );
  return Object.fromEntries(rows.map((r) => [r.Variable_name, Number(r.Value)]));
}

/** The database server's process id, from its pid file (it runs on this machine in every bench). */
export async function databasePid(sequelize: Sequelize): Promise<number | undefined> {
  const [row] = await sequelize.query<{ file: string }>('SELECT @@pid_file AS file', { type: QueryTypes.SELECT });
  return row && existsSync(row.file) ? Number(readFileSync(row.file, 'utf8').trim()) : undefined;
}

/** User + system CPU seconds of a process so far (Linux /proc), or NaN when unknown. */
export function cpuSeconds(pid?: number): number {
  if (!pid || !existsSync(`/proc/${pid}/stat`)) return NaN;
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  return (Number(fields[11]) + Number(fields[12])) / 100;
}

/** Adds each phase of a save's Server-Timing header (lock, engine, digest, write, audit, commit, answer …). */
function collectPhases(into: Map<string, number[]>, header: string | null): void {
  for (const part of (header ?? '').split(', ')) {
    const [name, dur] = part.split(';dur=');
    if (name && dur) into.set(name, [...(into.get(name) ?? []), Number(dur)]);
  }
}

/** Where a save's time goes: mean and p95 of each phase the server measured (ms, summed per request). */
function printPhases(phases: Map<string, number[]>): void {
  const cells = [...phases].map(([name, ms]) => {
    const f = figuresOf(ms, 1, 0);
    const mean = ms.reduce((a, b) => a + b, 0) / ms.length;
    return `${name} ${mean.toFixed(1)}/${f.p95.toFixed(1)}`;
  });
  // Only `app` (the whole answer) unless the server was started with SERVER_TIMING_PHASES=true (server/config.ts).
  const note = phases.size > 1 ? '' : ' (each phase: SERVER_TIMING_PHASES=true npm run bench)';
  console.log(`  phases, mean/p95 ms: ${cells.join(' · ')}${note}`);
}

/**
 * The chain head row is locked by every audit append until its transaction commits, so appends
 * across the whole company form one queue. This measures that queue's rate with nothing else
 * in the transactions: one appender, then twenty.
 */
export async function chainCeiling(sequelize: Sequelize, seconds: number): Promise<void> {
  console.log(`Audit chain head · bare appends (lock head, insert, move head, commit) · ${seconds / 2} s each`);
  for (const workers of [1, WRITERS]) {
    const latencies: number[] = [];
    const until = performance.now() + (seconds / 2) * 1000;
    await Promise.all(
      Array.from({ length: workers }, async (_, w) => {
        while (performance.now() < until) {
          const t0 = performance.now();
          await appendAudit(
            sequelize,
            { id: null, name: 'benchmark', ip: null },
            { action: 'bench.append', entityType: 'Bench', entityId: w, payload: { w } },
          );
          latencies.push(performance.now() - t0);
        }
      }),
    );
    console.log(
      line(`${workers} appender${workers > 1 ? 's' : ''}`, figuresOf(latencies, seconds / 2, 0)).replace(
        'req/s',
        'appends/s',
      ),
    );
  }
}

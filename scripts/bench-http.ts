// HTTP helpers of the list benchmark: the server as a child process, signed-in sessions, load runs.
import { fork, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import autocannon from 'autocannon';

export interface Figures {
  p50: number;
  p95: number;
  p99: number;
  rps: number;
  requests: number;
  errors: number;
}

const quantile = (sorted: number[], q: number) =>
  sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] : NaN;

export function figuresOf(latencies: number[], seconds: number, errors: number): Figures {
  const sorted = [...latencies].sort((a, b) => a - b);
  return {
    p50: quantile(sorted, 0.5),
    p95: quantile(sorted, 0.95),
    p99: quantile(sorted, 0.99),
    rps: latencies.length / seconds,
    requests: latencies.length,
    errors,
  };
}

/**
 * Starts server/main.ts (or another server `script`) under tsx on a free port and resolves with its base URL once it
 * listens.
 * BENCH_CPU_PROF=<folder> has the server write a V8 CPU profile there when it stops (open it in Chrome's DevTools).
 */
export function startServer(
  env: Record<string, string>,
  script = join(__dirname, '..', 'server', 'main.ts'),
): Promise<{ url: string; child: ChildProcess }> {
  const profile = process.env.BENCH_CPU_PROF ? ['--cpu-prof', `--cpu-prof-dir=${process.env.BENCH_CPU_PROF}`] : [];
  return new Promise((resolve, reject) => {
    const child = fork(script, [], {
      execArgv: ['--import', 'tsx', ...profile],
      env: { ...process.env, ...env, PORT: '0' },
      stdio: ['ignore', 'ignore', 'inherit', 'ipc'],
    });
    child.once('exit', (code) => reject(new Error(`the server exited with ${code} before listening`)));
    child.on('message', (m: { ready?: boolean; port?: number }) => {
      if (m.ready) resolve({ url: `http://127.0.0.1:${m.port}`, child });
    });
  });
}

export interface Session {
  cookie: string;
  csrf: string;
  /** Sent with every request of a load run besides the cookie (the browser's revision form). */
  headers?: Record<string, string>;
}

function cookiesOf(res: Response, previous = ''): string {
  const set = res.headers.getSetCookie().map((c) => c.split(';')[0]);
  return set.length ? set.join('; ') : previous;
}

export async function signIn(url: string, username: string, password: string): Promise<Session> {
  const first = await fetch(`${url}/api/session`);
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const login = await fetch(`${url}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie: cookiesOf(first) },
    body: JSON.stringify({ username, password }),
  });
  if (login.status !== 200) throw new Error(`sign-in of ${username} failed: ${login.status} ${await login.text()}`);
  const body = (await login.json()) as { csrfToken: string };
  return { cookie: cookiesOf(login, cookiesOf(first)), csrf: body.csrfToken };
}

/**
 * `connections` concurrent connections for `seconds`, each request on the next of `paths`; with several app instances
 * (`url` a list), the connections are shared out among them and their answers counted together.
 */
export async function load(
  url: string | string[],
  session: Session,
  paths: string[],
  connections: number,
  seconds: number,
): Promise<Figures> {
  const urls = typeof url === 'string' ? [url] : url;
  const runs = await Promise.all(
    urls.map((u, k) => answers(u, session, paths, Math.ceil((connections - k) / urls.length), seconds)),
  );
  return figuresOf(
    runs.flatMap((r) => r.latencies),
    seconds,
    runs.reduce((n, r) => n + r.errors, 0),
  );
}

async function answers(
  url: string,
  session: Session,
  paths: string[],
  connections: number,
  seconds: number,
): Promise<{ latencies: number[]; errors: number }> {
  const latencies: number[] = [];
  let errors = 0;
  let i = 0;
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon(
      {
        url,
        connections,
        duration: seconds,
        headers: { cookie: session.cookie, ...session.headers },
        requests: [{ method: 'GET', setupRequest: (req) => ({ ...req, path: paths[i++ % paths.length] }) }],
      },
      (err, res) => (err ? reject(err) : resolve(res)),
    );
    // Every answer's own time, for a true p95 (autocannon's summary has p90 and p97.5 only).
    instance.on('response', (_client, status, _bytes, time) => {
      if (status >= 200 && status < 300) latencies.push(time);
      else errors++;
    });
  });
  return { latencies, errors: errors + result.errors + result.timeouts };
}

/** "12.3 ms", or "no answer" where no request was answered in time (never a NaN in the figures). */
export function msText(v: number): string {
  return Number.isFinite(v) ? `${v.toFixed(1).padStart(7)} ms` : ' no answer';
}

export function line(name: string, f: Figures): string {
  const ms = msText;
  return `  ${name.padEnd(46)} ${ms(f.p50)} ${ms(f.p95)} ${ms(f.p99)} ${f.rps.toFixed(0).padStart(7)} req/s${f.errors ? `  (${f.errors} failed)` : ''}`;
}

import path from 'node:path';
import { fork, type ChildProcess } from 'node:child_process';
import request from 'supertest';
import { startTestApp } from '../support/api-harness';
import { serverProcessArgs } from '../support/bundle';

// APP_PROCESSES > 1: one primary process and that many app processes sharing its port (server/app-processes.ts).
const ROOT = path.resolve(__dirname, '../..');
const { sequelize } = startTestApp();

interface Message {
  ready?: boolean;
  port?: number;
  workers?: number[];
  workerReady?: number;
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

/** The next message from the primary that satisfies `wanted`. */
function nextMessage(child: ChildProcess, wanted: (m: Message) => boolean): Promise<Message> {
  return new Promise((resolve, reject) => {
    const onMessage = (m: Message) => {
      if (!wanted(m)) return;
      child.off('message', onMessage);
      resolve(m);
    };
    child.on('message', onMessage);
    child.once('exit', (code) => reject(new Error(`the primary exited with ${code}`)));
  });
}

let primary: ChildProcess;
afterAll(async () => {
  if (primary && primary.exitCode === null && primary.signalCode === null) primary.kill('SIGKILL');
  await sequelize.close();
});

describe('several app processes on one port', () => {
  it('when an app process is killed, then another takes its place, and SIGTERM stops them all', async () => {
    const { modulePath, execArgv } = await serverProcessArgs();
    primary = fork(modulePath, [], {
      cwd: ROOT,
      execArgv,
      stdio: ['ignore', 'ignore', 'inherit', 'ipc'],
      env: { ...process.env, PORT: '0', NODE_ENV: 'test', LOG_LEVEL: 'silent', APP_PROCESSES: '2' },
    });
    const ready = await nextMessage(primary, (m) => m.ready === true);
    const url = `http://127.0.0.1:${ready.port}`;
    const [first, second] = ready.workers!;
    expect(ready.workers).toHaveLength(2);

    process.kill(first, 'SIGKILL');
    const replaced = await nextMessage(primary, (m) => m.workerReady !== undefined);
    const health = await Promise.all(Array.from({ length: 6 }, () => request(url).get('/api/health')));

    expect(replaced.workers).toHaveLength(2);
    expect(replaced.workers).toContain(second);
    expect(replaced.workers).not.toContain(first);
    expect(health.map((r) => r.status)).toEqual([200, 200, 200, 200, 200, 200]);

    const exited = new Promise<number | null>((resolve) => primary.once('exit', (code) => resolve(code)));
    primary.kill('SIGTERM');
    expect(await exited).toBe(0);
    expect(replaced.workers!.filter(alive)).toEqual([]);
  });

  it('when the app processes cannot start, then the primary stops with an error instead of restarting them', async () => {
    const { modulePath, execArgv } = await serverProcessArgs();
    const child = fork(modulePath, [], {
      cwd: ROOT,
      execArgv,
      stdio: ['ignore', 'ignore', 'ignore', 'ipc'],
      // Nothing listens on port 1, so no app process reaches MariaDB.
      env: { ...process.env, PORT: '0', NODE_ENV: 'test', LOG_LEVEL: 'silent', APP_PROCESSES: '2', DB_PORT: '1' },
    });
    const code = await new Promise<number | null>((resolve) => child.once('exit', (c) => resolve(c)));
    expect(code).not.toBe(0);
  });
});

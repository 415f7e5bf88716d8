import path from 'node:path';
import { fork, type ChildProcess } from 'node:child_process';
import request from 'supertest';
import { createTestUser, sessionCookieOf, startTestApp, TEST_PASSWORD, uniqueCode } from '../support/api-harness';
import { serverProcessArgs } from '../support/bundle';

const ROOT = path.resolve(__dirname, '../..');
const { sequelize } = startTestApp();
const children: ChildProcess[] = [];

/** Starts server/main.ts in its own process on a free port; it reports `{ ready, port }` when listening. */
async function startServer(options: { tsx?: boolean }): Promise<string> {
  const { modulePath, execArgv } = await serverProcessArgs(options);
  return new Promise((resolve, reject) => {
    const child = fork(modulePath, [], {
      cwd: ROOT,
      execArgv,
      stdio: ['ignore', 'ignore', 'inherit', 'ipc'],
      env: { ...process.env, PORT: '0', HOST: '127.0.0.1', NODE_ENV: 'test', LOG_LEVEL: 'silent' },
    });
    children.push(child);
    child.once('message', (m: { ready?: boolean; port?: number }) =>
      m.ready ? resolve(`http://127.0.0.1:${m.port}`) : reject(new Error('odd message')),
    );
    child.once('exit', (code) => reject(new Error(`server process exited early with code ${code}`)));
  });
}

function stop(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const force = setTimeout(() => child.kill('SIGKILL'), 5_000);
    child.once('exit', () => {
      clearTimeout(force);
      resolve();
    });
    child.kill('SIGTERM');
  });
}

let first: string;
let second: string;
// Starting two server processes took over 30 s at load 39 on two cores, so the hooks set no limit of their own: the
// api project's hang detector (test/support/long-test-timeout.ts) covers them, as it covers every other spec.
beforeAll(async () => {
  // One as `npm start` runs it (under tsx), one bundled by esbuild as crash-signoff.spec.ts starts them: same sources.
  [first, second] = await Promise.all([startServer({ tsx: true }), startServer({ tsx: false })]);
});
afterAll(async () => {
  await Promise.all(children.map(stop));
  await sequelize.close();
});

describe('sessions across server processes', () => {
  it('when someone signs in on one process, then the other process knows them and accepts their writes', async () => {
    const admin = await createTestUser(['admin']);
    const agent = request.agent(first);
    const token = (await agent.get('/api/session')).body.csrfToken;
    const login = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', token)
      .send({ username: admin.username, password: TEST_PASSWORD });
    const cookie = sessionCookieOf(login);

    // The write goes first: GET /api/session hands out a new CSRF token, which would retire this one.
    const write = await request(second)
      .post('/api/projects')
      .set('Cookie', cookie)
      .set('x-csrf-token', login.body.csrfToken)
      .send({ code: uniqueCode('MP'), name: 'Two-process shaft' });
    const who = await request(second).get('/api/session').set('Cookie', cookie);

    expect(login.status).toBe(200);
    expect(who.body.user).toEqual(expect.objectContaining({ id: admin.id }));
    expect(write.status).toBe(201);
  });

  it('when someone signs out on one process, then the other process no longer knows them', async () => {
    const user = await createTestUser(['author']);
    const agent = request.agent(second);
    const token = (await agent.get('/api/session')).body.csrfToken;
    const login = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', token)
      .send({ username: user.username, password: TEST_PASSWORD });
    const cookie = sessionCookieOf(login);

    await request(first).post('/api/auth/logout').set('Cookie', cookie).set('x-csrf-token', login.body.csrfToken);
    const res = await request(second).get('/api/projects').set('Cookie', cookie);

    expect(res.status).toBe(401);
  });
});

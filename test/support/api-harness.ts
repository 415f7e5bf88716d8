import request from 'supertest';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { randomUUID } from 'node:crypto';
import { loadConfig, type Config } from '../../server/config';
import { createSequelize } from '../../server/db';
import { closeApp, createApp } from '../../server/app';
import { Project, User, UserRole } from '../../server/db/models';
import { hash } from '@node-rs/argon2';
import type { Role } from '../../shared/authz/roles';

export const TEST_PASSWORD = 'correct horse battery staple';
let cachedHash: Promise<string> | undefined;
// Test users get a cheap Argon2id hash (verification reads the cost from the hash itself), so the
// many sign-ins and signatures of the API tests do not queue on CPU-bound hashing; password.spec.ts
// proves that the product's own hashes use the production cost.
const TEST_HASH_COST = { algorithm: 2 /* Argon2id */, memoryCost: 1_024, timeCost: 1, parallelism: 1 } as const;

/**
 * A real app on the real test database; one per test file. `close()` ends the app's worker pool, sockets and
 * timers, then the database; so does `sequelize.close()`, which is what the spec files' afterAll calls, so that
 * nothing keeps the jest worker alive after the file (issue 14).
 */
export function startTestApp(overrides: Partial<Config> = {}): {
  app: Express;
  sequelize: Sequelize;
  config: Config;
  close: () => Promise<void>;
} {
  const config = Object.freeze({ ...loadConfig(), ...overrides });
  const sequelize = createSequelize(config);
  const app = createApp({ sequelize, config });
  const closeDb = sequelize.close.bind(sequelize);
  const close = async () => {
    await closeApp(app);
    await closeDb();
  };
  sequelize.close = close;
  return { app, sequelize, config, close };
}

/** Inserts a user with the given roles; usernames are unique per call so tests never collide. */
export async function createTestUser(roles: Role[], prefix = roles.join('-') || 'nobody') {
  cachedHash ??= hash(TEST_PASSWORD, TEST_HASH_COST);
  const username = `${prefix}-${randomUUID().slice(0, 8)}`.toLowerCase();
  const user = await User.create({
    username,
    displayName: `Test ${prefix}`,
    email: `${username}@example.test`,
    passwordHash: await cachedHash,
  });
  await UserRole.bulkCreate(roles.map((role) => ({ userId: user.id, role })));
  return { id: user.id, username };
}

/** A supertest agent that keeps cookies and sends the CSRF token on writes, like the browser client. */
export async function signedInAgent(app: Express, username: string, password = TEST_PASSWORD) {
  const agent = request.agent(app);
  let token = (await agent.get('/api/session')).body.csrfToken as string;
  const login = await agent.post('/api/auth/login').set('x-csrf-token', token).send({ username, password });
  if (login.status !== 200)
    throw new Error(`sign-in of ${username} failed: ${login.status} ${JSON.stringify(login.body)}`);
  token = login.body.csrfToken;
  return {
    agent,
    login,
    get csrf() {
      return token;
    },
    get: (url: string) => agent.get(url),
    post: (url: string, body?: object) => agent.post(url).set('x-csrf-token', token).send(body),
    patch: (url: string, body?: object) => agent.patch(url).set('x-csrf-token', token).send(body),
    put: (url: string, body?: object) => agent.put(url).set('x-csrf-token', token).send(body),
    delete: (url: string) => agent.delete(url).set('x-csrf-token', token),
  };
}

/** A unique project code (capitals, digits, dashes) so tests never collide on the unique index. */
export function uniqueCode(prefix = 'T'): string {
  return `${prefix}-${randomUUID().slice(0, 8)}`.toUpperCase();
}

/** Inserts a project directly, for tests that need one to exist without going through an admin. */
export async function createTestProject(
  overrides: Partial<{ code: string; name: string; status: 'active' | 'archived' }> = {},
) {
  const project = await Project.create({ code: uniqueCode(), name: 'Test drive shaft', createdBy: null, ...overrides });
  return { id: project.id, code: project.code, version: project.version };
}

/** A test user of the given roles, already signed in. */
export async function signedInAs(app: Express, roles: Role[], prefix?: string) {
  const user = await createTestUser(roles, prefix);
  return { user, session: await signedInAgent(app, user.username) };
}

/** An anonymous agent holding a valid CSRF token, so its writes reach the sign-in check (401). */
export async function anonymousAgent(app: Express) {
  const agent = request.agent(app);
  const token = (await agent.get('/api/session')).body.csrfToken as string;
  return { agent, token };
}

/** The `name=value` part of the session cookie a response set, for replaying it elsewhere. */
export function sessionCookieOf(res: { headers: Record<string, unknown> }): string {
  const cookies = (res.headers['set-cookie'] as string[] | undefined) ?? [];
  const cookie = cookies.find((c) => c.startsWith('tt.sid='));
  if (!cookie) throw new Error('response set no session cookie');
  return cookie.split(';')[0];
}

export type Session = Awaited<ReturnType<typeof signedInAs>>['session'];
export type Person = Awaited<ReturnType<typeof signedInAs>>;

/**
 * A signed-in test person whose display name is unique, so a printed name on a signature can
 * only have come from them. `label` is short and lower-case (it is part of the username).
 */
export async function person(app: Express, roles: Role[], label = roles.join('-')) {
  const tag = `${label}-${randomUUID().slice(0, 4)}`;
  const p = await signedInAs(app, roles, tag);
  return { ...p, displayName: `Test ${tag}`, email: `${p.user.username}@example.test` };
}

/** Fails loudly with the response body when a set-up step does not answer as expected. */
export function expectStatus<T extends { status: number; body: unknown }>(res: T, status: number, step: string): T {
  if (res.status !== status)
    throw new Error(`${step}: expected ${status}, got ${res.status} ${JSON.stringify(res.body)}`);
  return res;
}

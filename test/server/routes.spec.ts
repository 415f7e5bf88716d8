import type { Test } from 'supertest';
import { anonymousAgent, signedInAs, startTestApp } from '../support/api-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';
const MISSING = 2147483000;

// Every route behind sign-in, with a body that would pass validation.
const PROTECTED: [Method, string, object?][] = [
  ['get', '/api/users'],
  ['post', '/api/users', { username: 'nobody-here', displayName: 'No Body', email: 'n@example.test', roles: ['author'], initialPassword: 'long enough password' }],
  ['get', '/api/users/1'],
  ['patch', '/api/users/1', { displayName: 'New Name', version: 0 }],
  ['put', '/api/users/1/active', { active: false }],
  ['delete', '/api/users/1'],
  ['get', '/api/projects'],
  ['post', '/api/projects', { code: 'ANON-1', name: 'Anonymous shaft' }],
  ['get', '/api/projects/1'],
  ['patch', '/api/projects/1', { name: 'Anonymous rename', version: 0 }],
  ['get', '/api/audit'],
  ['get', '/api/audit/verify'],
  ['get', '/api/dashboard'],
  ['post', '/api/auth/password', { currentPassword: 'whatever', newPassword: 'long enough password' }],
  ['get', '/api/auth/sessions'],
  ['delete', '/api/auth/sessions/0123456789abcdef0123456789abcdef'],
  ['get', '/api/role-grants'],
  ['post', '/api/role-grants/1/confirm', { password: 'whatever' }],
  ['post', '/api/role-grants/1/refuse', { reason: 'not needed' }],
];

const BY_ID: [Method, string, object?][] = [
  ['get', '/api/users/:id'],
  ['patch', '/api/users/:id', { displayName: 'New Name', version: 0 }],
  ['put', '/api/users/:id/active', { active: false }],
  ['get', '/api/projects/:id'],
  ['patch', '/api/projects/:id', { name: 'Renamed shaft', version: 0 }],
  ['post', '/api/role-grants/:id/refuse', { reason: 'not needed' }],
];

function send(test: Test, body?: object | null): Test {
  return body ? test.send(body) : test;
}

// jest passes `done` to a test whose table row is shorter than its parameter list: pad the rows.
const padded = (rows: [Method, string, object?][]) => rows.map(([m, u, b]) => [m, u, b ?? null] as const);

describe('every route behind sign-in', () => {
  it.each(padded(PROTECTED))('when nobody is signed in and %s %s is called, then it is a JSON 401', async (method, url, body) => {
    const { agent, token } = await anonymousAgent(app);
    const res = await send(agent[method](url).set('x-csrf-token', token), body);
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ code: 'sign_in_required', message: 'Sign in to continue' });
  });
});

describe('routes with an id', () => {
  let admin: Awaited<ReturnType<typeof signedInAs>>['session'];
  beforeAll(async () => {
    ({ session: admin } = await signedInAs(app, ['admin']));
  });

  it.each(padded(BY_ID))('when %s %s names an unknown id, then it is a JSON 404', async (method, url, body) => {
    const res = await send(admin.agent[method](url.replace(':id', String(MISSING))).set('x-csrf-token', admin.csrf), body);
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ code: 'not_found', message: expect.stringContaining(`${MISSING} was not found`) });
  });

  it.each(padded(BY_ID).flatMap(([m, u, b]) => ['abc', '1.5', '-3', '0', '1e3x'].map((id) => [m, u.replace(':id', id), b] as const)))(
    'when %s %s has an id that is not a positive whole number, then it is a 400 naming params.id',
    async (method, url, body) => {
      const res = await send(admin.agent[method](url).set('x-csrf-token', admin.csrf), body);
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.fieldErrors)).toEqual(['params.id']);
    },
  );
});

describe('unknown API routes', () => {
  it.each([
    ['get', '/api/nothing-here'],
    ['post', '/api/nothing-here'],
    ['get', '/api/users/1/nothing-here'],
    // Projects are archived, never deleted, so this route does not exist.
    ['delete', '/api/projects/1'],
  ] as [Method, string][])('when %s %s is called, then it is a JSON 404 naming the route', async (method, url) => {
    const { session } = await signedInAs(app, ['author']);
    const res = await session.agent[method](url).set('x-csrf-token', session.csrf);
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(res.body).toEqual({ code: 'not_found', message: `No API route ${method.toUpperCase()} ${url}` });
  });
});

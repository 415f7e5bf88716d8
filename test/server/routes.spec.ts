import type { Test } from 'supertest';
import { anonymousAgent, signedInAs, startTestApp } from '../support/api-harness';
import { allRoutes, type Method } from '../support/route-list';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

const MISSING = 2147483000;

// The only routes that answer without a session; every other route the app has must be a 401.
const PUBLIC = ['GET /api/health', 'GET /api/session', 'POST /api/auth/login', 'POST /api/auth/logout'];
// Built from the app's router stack, so a route added anywhere is checked without editing this file.
const API_ROUTES = allRoutes(app).filter((r) => r.path.startsWith('/api/'));
const PROTECTED = API_ROUTES.filter((r) => !PUBLIC.includes(`${r.method.toUpperCase()} ${r.path}`));
// Sign-in is checked before any parameter or body, so any value stands in for a path parameter.
const urlOf = (path: string) => path.replace(/:\w+/g, '1');

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
  it('when the router stack is read, then it lists every area and the public routes', () => {
    expect(API_ROUTES.length).toBeGreaterThanOrEqual(67);
    expect(API_ROUTES.map((r) => `${r.method.toUpperCase()} ${r.path}`)).toEqual(expect.arrayContaining(PUBLIC));
  });

  it.each(PROTECTED.map((r) => [r.method, r.path] as const))(
    'when nobody is signed in and %s %s is called, then it is a JSON 401',
    async (method, path) => {
      const { agent, token } = await anonymousAgent(app);
      const res = await agent[method](urlOf(path)).set('x-csrf-token', token);
      expect(res.status).toBe(401);
      expect(res.body).toEqual({ code: 'sign_in_required', message: 'Sign in to continue' });
    },
  );
});

describe('routes with an id', () => {
  let admin: Awaited<ReturnType<typeof signedInAs>>['session'];
  beforeAll(async () => {
    ({ session: admin } = await signedInAs(app, ['admin']));
  });

  it.each(padded(BY_ID))('when %s %s names an unknown id, then it is a JSON 404', async (method, url, body) => {
    const res = await send(
      admin.agent[method](url.replace(':id', String(MISSING))).set('x-csrf-token', admin.csrf),
      body,
    );
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ code: 'not_found', message: expect.stringContaining(`${MISSING} was not found`) });
  });

  it.each(
    padded(BY_ID).flatMap(([m, u, b]) =>
      ['abc', '1.5', '-3', '0', '1e3x'].map((id) => [m, u.replace(':id', id), b] as const),
    ),
  )(
    'when %s %s has an id that is not a positive whole number, then it is a 400 naming params.id',
    async (method, url, body) => {
      const res = await send(admin.agent[method](url).set('x-csrf-token', admin.csrf), body);
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.fieldErrors)).toEqual(['params.id']);
    },
  );

  // Every numeric :id of the router stack (a session id is a hex token, not a record id).
  const numericIdRoutes = PROTECTED.filter((r) => r.path.includes('/:id') && r.path !== '/api/auth/sessions/:id');
  it.each(numericIdRoutes.map((r) => [r.method, r.path] as const))(
    'when %s %s has the id "abc", then it is a 400 naming params.id before anything else is read',
    async (method, path) => {
      const res = await admin.agent[method](urlOf(path.replace(':id', 'abc'))).set('x-csrf-token', admin.csrf);
      expect(res.status).toBe(400);
      expect(res.body.fieldErrors).toEqual({ 'params.id': ['must be a number'] });
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

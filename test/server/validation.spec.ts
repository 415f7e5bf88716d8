import { fieldLabel } from '../../shared/engine/field-places';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { createTestUser, signedInAs, startTestApp, TEST_PASSWORD } from '../support/api-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Session = Awaited<ReturnType<typeof signedInAs>>['session'];
let admin: Session;
beforeAll(async () => {
  ({ session: admin } = await signedInAs(app, ['admin']));
});

// A stack trace in a response body would name server files and line numbers.
const expectNoStack = (body: unknown) => expect(JSON.stringify(body)).not.toMatch(/\.ts:\d+|\bat \w+ \(/);

describe('malformed bodies', () => {
  it('when a sign-in body is not valid JSON, then it is a 400, not a 500', async () => {
    const res = await request(app)
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .send('{"username": "a", ');
    expect(res.status).toBe(400);
    expect(res.body.message).toBe('Request body is not valid JSON');
    expectNoStack(res.body);
  });

  it('when a signed-in PATCH body is not valid JSON, then it is a 400, not a 500', async () => {
    const user = await createTestUser(['author']);
    const res = await admin.agent
      .patch(`/api/users/${user.id}`)
      .set('x-csrf-token', admin.csrf)
      .set('Content-Type', 'application/json')
      .send('{"version": 0,,}');
    expect(res.status).toBe(400);
    expectNoStack(res.body);
  });

  // express.json takes at most 1 MB (app.ts); this body is just past it.
  it('when a body is larger than the limit, then it is a 413 in JSON', async () => {
    const res = await admin.post('/api/projects', { code: 'BIG-1', name: 'Big', description: 'x'.repeat(1_100_000) });
    expect(res.status).toBe(413);
    expect(res.body.message).toEqual(expect.any(String));
    expectNoStack(res.body);
  });

  it('when a body is not JSON at all, then the missing fields are named', async () => {
    const res = await admin.agent
      .post('/api/projects')
      .set('x-csrf-token', admin.csrf)
      .set('Content-Type', 'text/plain')
      .send('code=X');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors).sort()).toEqual(['code', 'name']);
  });

  it('when a body is a JSON array, then it is a 400', async () => {
    const res = await admin.post('/api/projects', [{ code: 'ARR-1', name: 'Array body' }]);
    expect(res.status).toBe(400);
    expectNoStack(res.body);
  });
});

describe('field errors', () => {
  it.each([
    ['username', { username: 'Has Capitals' }],
    ['email', { email: 'not-an-email' }],
    ['initialPassword', { initialPassword: 'short' }],
    ['roles', { roles: [] }],
    ['roles', { roles: ['author', 'author'] }],
    ['roles[0]', { roles: ['superuser'] }],
    ['displayName', { displayName: 'x' }],
  ])('when a new user has a bad %s, then the 400 names it and says why', async (field, change) => {
    const body = {
      username: 'valid-name',
      displayName: 'Valid Name',
      email: 'v@example.test',
      roles: ['author'],
      initialPassword: TEST_PASSWORD,
      ...change,
    };

    const res = await admin.post('/api/users', body);

    expect(res.status).toBe(400);
    expect(res.body.code).toBe('validation');
    expect(Object.keys(res.body.fieldErrors)).toEqual([field]);
    expect(res.body.fieldErrors[field][0]).toMatch(/\w{3,}/);
    // The summary names the field as the form labels it (Username, Email, Roles).
    expect(res.body.message).toContain(fieldLabel(field));
  });

  // Create and update schemas are strict: a field that is not on the form is named and refused.
  it('when a new user body carries fields that are not part of the form, then it is refused naming them', async () => {
    const username = `extra-${randomUUID().slice(0, 8)}`;
    const body = {
      username,
      displayName: 'Extra Fields',
      email: 'e@example.test',
      roles: ['author'],
      initialPassword: TEST_PASSWORD,
    };

    const res = await admin.post('/api/users', { ...body, active: false, passwordHash: 'forged' });

    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors).sort()).toEqual(['active', 'passwordHash']);
    expect((await admin.get(`/api/users?q=${username}`)).body.total).toBe(0);
  });

  it.each([
    ['active', { active: 'no' }],
    ['active', {}],
    ['version', { active: false, version: 3 }],
  ])('when the active switch has a bad %s, then the 400 names it', async (field, body) => {
    const user = await createTestUser(['author']);
    const res = await admin.put(`/api/users/${user.id}/active`, body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors)).toEqual([field]);
  });

  it.each([
    ['/api/users?size=1000', 'query.size'],
    ['/api/users?page=-1', 'query.page'],
    ['/api/projects?size=abc', 'query.size'],
    ['/api/audit?size=0', 'query.size'],
  ])('when %s is asked for, then the 400 names %s', async (url, field) => {
    const res = await admin.get(url);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors)).toEqual([field]);
  });
});

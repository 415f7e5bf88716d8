import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type { Response } from 'supertest';
import type { Role } from '../../shared/authz/roles';
import { createTestProject, createTestUser, signedInAs, startTestApp, TEST_PASSWORD } from '../support/api-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Allowed = boolean;
interface Expected {
  seesAllUsers: Allowed;
  managesUsers: Allowed;
  managesProjects: Allowed;
  readsAudit: Allowed;
}

// One row per role, plus people holding two roles: their permissions are the union of both.
const MATRIX: [string, Role[], Expected][] = [
  ['author', ['author'], { seesAllUsers: false, managesUsers: false, managesProjects: false, readsAudit: false }],
  ['checker', ['checker'], { seesAllUsers: false, managesUsers: false, managesProjects: false, readsAudit: false }],
  ['approver', ['approver'], { seesAllUsers: false, managesUsers: false, managesProjects: false, readsAudit: false }],
  [
    'compliance',
    ['compliance'],
    { seesAllUsers: false, managesUsers: false, managesProjects: false, readsAudit: true },
  ],
  ['admin', ['admin'], { seesAllUsers: true, managesUsers: true, managesProjects: true, readsAudit: true }],
  [
    'author + checker',
    ['author', 'checker'],
    { seesAllUsers: false, managesUsers: false, managesProjects: false, readsAudit: false },
  ],
  [
    'author + admin',
    ['author', 'admin'],
    { seesAllUsers: true, managesUsers: true, managesProjects: true, readsAudit: true },
  ],
];

// A forbidden answer must explain itself: the client shows the message as it comes.
function expectAllowedOr403(res: Response, allowed: boolean, okStatus = 200): void {
  if (allowed) {
    expect(res.status).toBe(okStatus);
    return;
  }
  expect(res.status).toBe(403);
  expect(res.body).toEqual(expect.objectContaining({ code: 'forbidden', message: expect.any(String) }));
  expect(res.body.message.length).toBeGreaterThan(5);
}

const newUserBody = () => ({
  username: `made-${randomUUID().slice(0, 8)}`,
  displayName: 'Made In Test',
  email: 'made@example.test',
  roles: ['author'],
  initialPassword: TEST_PASSWORD,
});

describe.each(MATRIX)('permission matrix: %s', (_label, roles, expected) => {
  let s: Awaited<ReturnType<typeof signedInAs>>['session'];
  let me: { id: number; username: string };
  beforeAll(async () => {
    ({ session: s, user: me } = await signedInAs(app, roles));
  });

  // Everyone may read their own account (the profile page), so a non-admin's user list is just themselves.
  it(`when they list users, then they see ${expected.seesAllUsers ? 'everyone' : 'only themselves'}`, async () => {
    const other = await createTestUser(['checker']);
    const others = await s.get(`/api/users?q=${other.username}`);
    const own = await s.get(`/api/users?q=${me.username}`);
    expect([others.status, own.status]).toEqual([200, 200]);
    expect(others.body.items.map((u: { id: number }) => u.id)).toEqual(expected.seesAllUsers ? [other.id] : []);
    expect(own.body.items.map((u: { id: number }) => u.id)).toEqual([me.id]);
  });

  it(`when they create a user, then the API answers ${expected.managesUsers ? 201 : 403}`, async () => {
    expectAllowedOr403(await s.post('/api/users', newUserBody()), expected.managesUsers, 201);
  });

  it(`when they rename another user, then the API answers ${expected.managesUsers ? 200 : 403}`, async () => {
    const target = await createTestUser(['author']);
    const res = await s.patch(`/api/users/${target.id}`, { displayName: 'Renamed Person', version: 0 });
    expectAllowedOr403(res, expected.managesUsers);
  });

  it(`when they deactivate another user, then the API answers ${expected.managesUsers ? 200 : 403}`, async () => {
    const target = await createTestUser(['author']);
    expectAllowedOr403(await s.put(`/api/users/${target.id}/active`, { active: false }), expected.managesUsers);
  });

  it('when they list projects, then they see the active ones', async () => {
    const project = await createTestProject();
    const res = await s.get(`/api/projects?q=${project.code}`);
    expect(res.status).toBe(200);
    expect(res.body.items.map((p: { id: number }) => p.id)).toEqual([project.id]);
  });

  it(`when they create a project, then the API answers ${expected.managesProjects ? 201 : 403}`, async () => {
    const res = await s.post('/api/projects', {
      code: `P-${randomUUID().slice(0, 8)}`.toUpperCase(),
      name: 'Conveyor head shaft',
    });
    expectAllowedOr403(res, expected.managesProjects, 201);
  });

  it(`when they update a project, then the API answers ${expected.managesProjects ? 200 : 403}`, async () => {
    const project = await createTestProject();
    const res = await s.patch(`/api/projects/${project.id}`, { name: 'Renamed head shaft', version: project.version });
    expectAllowedOr403(res, expected.managesProjects);
  });

  it(`when they read the audit trail, then the API answers ${expected.readsAudit ? 200 : 403}`, async () => {
    expectAllowedOr403(await s.get('/api/audit'), expected.readsAudit);
    expectAllowedOr403(await s.get('/api/audit/verify'), expected.readsAudit);
  });

  it('when they open the dashboard, then it shows only what their roles allow', async () => {
    const res = await s.get('/api/dashboard');
    expect(res.status).toBe(200);
    expect(res.body.counts.activeProjects).toEqual(expect.any(Number));
    expect('activeUsers' in res.body.counts).toBe(expected.managesUsers);
    expect(res.body.recentActivity !== null).toBe(expected.readsAudit);
  });
});

describe('permission matrix: anonymous', () => {
  it.each(['/api/users', '/api/projects', '/api/audit', '/api/audit/verify', '/api/dashboard'])(
    'when nobody is signed in and GET %s is asked for, then the API answers 401 with a message',
    async (url) => {
      const res = await request(app).get(url);
      expect(res.status).toBe(401);
      expect(res.body).toEqual({ code: 'sign_in_required', message: 'Sign in to continue' });
    },
  );
});

import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { User } from '../../server/db/models';
import { createTestUser, signedInAgent, signedInAs, startTestApp, TEST_PASSWORD } from '../support/api-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

const newUserBody = (overrides: object = {}) => ({
  username: `made-${randomUUID().slice(0, 8)}`,
  displayName: 'Made In Test',
  email: 'made@example.test',
  roles: ['author', 'checker'],
  initialPassword: TEST_PASSWORD,
  ...overrides,
});

describe('creating users', () => {
  it('when an admin creates a user, then the new person can sign in and their signing roles wait for a second person', async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const body = newUserBody();

    const res = await admin.post('/api/users', body);

    expect(res.status).toBe(201);
    expect(res.body).toEqual(
      expect.objectContaining({
        username: body.username,
        roles: [],
        pendingRoles: ['author', 'checker'],
        active: true,
        version: 0,
      }),
    );
    expect(JSON.stringify(res.body)).not.toMatch(/password/i);
    await expect(signedInAgent(app, body.username)).resolves.toBeDefined();
  });

  it('when a username was used before, even by a deactivated account, then creating it again gets 409', async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const old = await createTestUser(['author']);
    await admin.put(`/api/users/${old.id}/active`, { active: false });

    const res = await admin.post('/api/users', newUserBody({ username: old.username }));

    expect(res.status).toBe(409);
    expect(res.body.fieldErrors).toEqual({ username: ['is already taken'] });
  });
});

// Signatures and audit entries point at accounts forever; 405 says the method itself is not offered.
describe('users are never deleted', () => {
  it('when an admin sends DELETE for a user, then it is refused and the user is still there', async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const target = await createTestUser(['author']);

    const res = await admin.delete(`/api/users/${target.id}`);

    expect(res.status).toBe(405);
    expect(res.body.message).toMatch(/never deleted/);
    expect((await admin.get(`/api/users/${target.id}`)).body.username).toBe(target.username);
  });
});

// No admin route takes someone else's password: PATCH is strict and POST /api/auth/password acts on the caller only.
describe("another person's password", () => {
  it.each(['password', 'newPassword', 'initialPassword', 'passwordHash'])(
    'when an admin PATCHes a user with a %s field, then it is a 400 naming that field and the password still works',
    async (field) => {
      const { session: admin } = await signedInAs(app, ['admin']);
      const target = await createTestUser(['author']);

      const res = await admin.patch(`/api/users/${target.id}`, { version: 0, [field]: 'a-brand-new-password' });

      expect(res.status).toBe(400);
      expect(Object.keys(res.body.fieldErrors)).toEqual([field]);
      await expect(signedInAgent(app, target.username, TEST_PASSWORD)).resolves.toBeDefined();
    },
  );

  it('when an admin changes a password, then it is only ever their own', async () => {
    const { user, session: admin } = await signedInAs(app, ['admin']);

    const res = await admin.post('/api/auth/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: 'an admin-only new password',
    });

    expect(res.status).toBe(204);
    await expect(signedInAgent(app, user.username, 'an admin-only new password')).resolves.toBeDefined();
  });
});

describe('deactivating users', () => {
  // Sessions live in MariaDB and deactivation deletes the person's rows, on every app instance at once.
  it('when an admin deactivates a signed-in user, then their next request gets 401 and they cannot sign in', async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const { user, session: target } = await signedInAs(app, ['author']);
    expect((await target.get('/api/projects')).status).toBe(200);

    const res = await admin.put(`/api/users/${user.id}/active`, { active: false });

    expect(res.status).toBe(200);
    expect(res.body.active).toBe(false);
    expect((await target.get('/api/projects')).status).toBe(401);
    await expect(signedInAgent(app, user.username)).rejects.toThrow(/401/);
  });

  it('when an admin reactivates a user, then they can sign in again', async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const target = await createTestUser(['author']);
    await admin.put(`/api/users/${target.id}/active`, { active: false });

    const res = await admin.put(`/api/users/${target.id}/active`, { active: true });

    expect(res.body.active).toBe(true);
    await expect(signedInAgent(app, target.username)).resolves.toBeDefined();
  });

  it('when admins try to deactivate themselves, then it is a 400 and they stay active', async () => {
    const { user, session: admin } = await signedInAs(app, ['admin']);

    const res = await admin.put(`/api/users/${user.id}/active`, { active: false });

    expect(res.status).toBe(400);
    expect((await User.findByPk(user.id))!.active).toBe(true);
  });
});

describe('changing users', () => {
  it("when an admin changes someone's roles, then that person's next request has the new rules", async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const { user, session: target } = await signedInAs(app, ['author']);

    const res = await admin.patch(`/api/users/${user.id}`, { roles: ['compliance'], version: 0 });

    expect(res.status).toBe(200);
    expect(res.body).toEqual(expect.objectContaining({ roles: ['compliance'], version: 1 }));
    expect((await target.get('/api/audit')).status).toBe(200);
  });

  it('when two admins PATCH the same user from the same version, then the second gets 409', async () => {
    const { session: first } = await signedInAs(app, ['admin']);
    const { session: second } = await signedInAs(app, ['admin']);
    const target = await createTestUser(['author']);

    const a = await first.patch(`/api/users/${target.id}`, { displayName: 'First Edit', version: 0 });
    const b = await second.patch(`/api/users/${target.id}`, { displayName: 'Second Edit', version: 0 });

    expect([a.status, b.status]).toEqual([200, 409]);
    expect((await User.findByPk(target.id))!.displayName).toBe('First Edit');
  });

  // Regression: a PATCH without fields used to skip the permission check and bump the version.
  it('when a non-admin PATCHes another user with only a version, then it is 403 and nothing changes', async () => {
    const { session: author } = await signedInAs(app, ['author']);
    const target = await createTestUser(['checker']);

    const res = await author.patch(`/api/users/${target.id}`, { version: 0 });

    expect(res.status).toBe(403);
    expect((await User.findByPk(target.id))!.version).toBe(0);
  });

  it('when the caller is anonymous, then reading a user is 401', async () => {
    const target = await createTestUser(['author']);
    expect((await request(app).get(`/api/users/${target.id}`)).status).toBe(401);
  });
});

describe('searching people', () => {
  it('when the search holds an underscore, then it is taken literally, not as a wildcard', async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const person = await createTestUser(['author'], 'lit');
    const name = person.username;
    const found = async (q: string) =>
      (await admin.get(`/api/users?q=${encodeURIComponent(q)}&size=100`)).body.items.map((u: { id: number }) => u.id);

    expect(await found(name)).toEqual([person.id]);
    expect(await found(`${name.slice(0, 2)}_${name.slice(3)}`)).not.toContain(person.id);
  });
});

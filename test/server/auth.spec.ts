import { randomUUID } from 'node:crypto';
import { User } from '../../server/db/models';
import {
  anonymousAgent,
  createTestUser,
  signedInAgent,
  signedInAs,
  startTestApp,
  TEST_PASSWORD,
} from '../support/api-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

// A fresh agent with a CSRF token per attempt, as a browser has before its first sign-in.
async function attemptSignIn(body: object) {
  const { agent, token } = await anonymousAgent(app);
  return agent.post('/api/auth/login').set('x-csrf-token', token).send(body);
}

describe('signing in', () => {
  it('when the password is right, then the answer carries the user, their rules and a fresh CSRF token', async () => {
    const user = await createTestUser(['checker']);

    const res = await attemptSignIn({ username: user.username, password: TEST_PASSWORD });

    expect(res.status).toBe(200);
    expect(res.body.user).toEqual(
      expect.objectContaining({ id: user.id, username: user.username, roles: ['checker'] }),
    );
    expect(res.body.rules).toEqual(
      expect.arrayContaining([expect.objectContaining({ action: 'read', subject: 'User' })]),
    );
    expect(res.body.csrfToken).toEqual(expect.any(String));
    expect(JSON.stringify(res.body)).not.toMatch(/passwordHash/);
    expect((await User.findByPk(user.id))!.lastSignInAt).not.toBeNull();
  });

  it('when the username is typed in capitals with spaces, then it still signs in', async () => {
    const user = await createTestUser(['author']);
    const res = await attemptSignIn({ username: `  ${user.username.toUpperCase()} `, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
  });

  // One answer for all three, so it never tells anyone which usernames exist or are switched off.
  it('when the password is wrong or the username unknown or the account inactive, then all get the same 401', async () => {
    const user = await createTestUser(['author']);
    const inactive = await createTestUser(['author']);
    await User.update({ active: false }, { where: { id: inactive.id } });

    const wrongPassword = await attemptSignIn({ username: user.username, password: 'not the password' });
    const unknownUser = await attemptSignIn({ username: `ghost-${randomUUID().slice(0, 8)}`, password: TEST_PASSWORD });
    const inactiveUser = await attemptSignIn({ username: inactive.username, password: TEST_PASSWORD });

    for (const res of [wrongPassword, unknownUser, inactiveUser]) {
      expect(res.status).toBe(401);
      expect(res.body).toEqual({ code: 'sign_in_failed', message: 'Username or password is not correct' });
    }
  });

  it.each([
    ['username', { password: TEST_PASSWORD }],
    ['username', { username: '', password: TEST_PASSWORD }],
    ['password', { username: 'someone' }],
    ['password', { username: 'someone', password: 42 }],
    ['username', { username: 'x'.repeat(65), password: TEST_PASSWORD }],
  ])('when the body lacks a valid %s, then it is a 400 naming it', async (field, body) => {
    const res = await attemptSignIn(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors)).toEqual([field]);
  });
});

describe('the session endpoint', () => {
  it('when nobody is signed in, then it answers 200 with no user and no rules', async () => {
    const { agent } = await anonymousAgent(app);
    const res = await agent.get('/api/session');
    expect(res.status).toBe(200);
    expect(res.body).toEqual(expect.objectContaining({ user: null, rules: [], csrfToken: expect.any(String) }));
  });

  it('when someone is signed in, then it returns them', async () => {
    const { user, session } = await signedInAs(app, ['approver']);
    const res = await session.get('/api/session');
    expect(res.body.user).toEqual(expect.objectContaining({ id: user.id, roles: ['approver'] }));
  });
});

describe('signing out', () => {
  it('when a signed-in user signs out, then the cookie no longer works', async () => {
    const { session } = await signedInAs(app, ['author']);

    const res = await session.post('/api/auth/logout');

    expect(res.status).toBe(204);
    expect((await session.get('/api/projects')).status).toBe(401);
  });
});

describe('changing your own password', () => {
  it('when the current password is right, then the new one works and the old one does not', async () => {
    const { user, session } = await signedInAs(app, ['author']);

    const res = await session.post('/api/auth/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: 'a much longer new password',
    });

    expect(res.status).toBe(204);
    await expect(signedInAgent(app, user.username, 'a much longer new password')).resolves.toBeDefined();
    await expect(signedInAgent(app, user.username, TEST_PASSWORD)).rejects.toThrow(/401/);
  });

  it.each([
    ['currentPassword', { currentPassword: 'not it at all', newPassword: 'a much longer new password' }],
    ['newPassword', { currentPassword: TEST_PASSWORD, newPassword: 'short' }],
    ['newPassword', { currentPassword: TEST_PASSWORD, newPassword: TEST_PASSWORD }],
    ['currentPassword', { newPassword: 'a much longer new password' }],
  ])('when %s is not acceptable, then it is a 400 naming it', async (field, body) => {
    const { session } = await signedInAs(app, ['author']);
    const res = await session.post('/api/auth/password', body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors)).toEqual([field]);
  });

  it('when nobody is signed in, then it is a 401', async () => {
    const { agent, token } = await anonymousAgent(app);
    const res = await agent
      .post('/api/auth/password')
      .set('x-csrf-token', token)
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'a much longer new password' });
    expect(res.status).toBe(401);
  });
});

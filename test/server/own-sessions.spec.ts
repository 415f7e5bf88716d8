import request from 'supertest';
import { AuditEvent } from '../../server/db/models';
import type { ActiveSessionDto } from '../../shared/schemas/session-list.schema';
import { createTestUser, signedInAgent, startTestApp, TEST_PASSWORD } from '../support/api-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

/** Signs in from a named browser, as a person with two devices would. */
async function signInWith(username: string, userAgent: string) {
  const agent = request.agent(app).set('user-agent', userAgent);
  const token = (await agent.get('/api/session')).body.csrfToken as string;
  const login = await agent
    .post('/api/auth/login')
    .set('x-csrf-token', token)
    .send({ username, password: TEST_PASSWORD })
    .expect(200);
  const csrf = login.body.csrfToken as string;
  return {
    get: (url: string) => agent.get(url),
    post: (url: string, body?: object) => agent.post(url).set('x-csrf-token', csrf).send(body),
    delete: (url: string) => agent.delete(url).set('x-csrf-token', csrf),
  };
}

async function sessionsOf(session: { get: (url: string) => request.Test }): Promise<ActiveSessionDto[]> {
  const res = await session.get('/api/auth/sessions').expect(200);
  return res.body;
}

describe('a password change', () => {
  it('when a person changes their password, then their other sessions end and this one stays', async () => {
    const user = await createTestUser(['author']);
    const laptop = await signInWith(user.username, 'Laptop/1');
    const phone = await signInWith(user.username, 'Phone/1');

    await laptop
      .post('/api/auth/password', { currentPassword: TEST_PASSWORD, newPassword: 'a much longer new password' })
      .expect(204);

    expect((await phone.get('/api/projects')).status).toBe(401);
    expect((await phone.get('/api/session')).body.user).toBeNull();
    expect((await laptop.get('/api/projects')).status).toBe(200);
    const audit = await AuditEvent.findOne({ where: { action: 'auth.password_changed', actorId: user.id } });
    expect(JSON.parse(audit!.payload)).toEqual({ endedSessions: 1 });
  });

  it('when another person changes their password, then my sessions go on', async () => {
    const me = await createTestUser(['checker']);
    const other = await createTestUser(['checker']);
    const mine = await signedInAgent(app, me.username);
    const theirs = await signedInAgent(app, other.username);

    await theirs
      .post('/api/auth/password', { currentPassword: TEST_PASSWORD, newPassword: 'another long new password' })
      .expect(204);

    expect((await mine.get('/api/projects')).status).toBe(200);
  });
});

describe('the list of my sessions', () => {
  it('when I am signed in twice, then both are listed with start, last use, address and browser, mine marked', async () => {
    const user = await createTestUser(['approver']);
    const laptop = await signInWith(user.username, 'Laptop/2');
    await signInWith(user.username, 'Phone/2');

    const list = await sessionsOf(laptop);

    expect(list).toHaveLength(2);
    expect(list.map((s) => s.userAgent).sort()).toEqual(['Laptop/2', 'Phone/2']);
    expect(list.find((s) => s.current)?.userAgent).toBe('Laptop/2');
    for (const s of list) {
      expect(s.id).toMatch(/^[0-9a-f]{32}$/);
      expect(s.ip).toMatch(/127\.0\.0\.1|::1/);
      expect(Date.parse(s.lastSeenAt)).toBeGreaterThanOrEqual(Date.parse(s.startedAt));
    }
  });

  it('when I end my other session, then it is signed out, the ending is audited and the list shrinks', async () => {
    const user = await createTestUser(['author']);
    const laptop = await signInWith(user.username, 'Laptop/3');
    const phone = await signInWith(user.username, 'Phone/3');
    const other = (await sessionsOf(laptop)).find((s) => !s.current)!;

    await laptop.delete(`/api/auth/sessions/${other.id}`).expect(204);

    expect((await phone.get('/api/projects')).status).toBe(401);
    expect(await sessionsOf(laptop)).toHaveLength(1);
    expect(await AuditEvent.count({ where: { action: 'auth.session_ended', actorId: user.id } })).toBe(1);
  });

  it('when I try to end the session I am using, then it is a 400 pointing to sign-out', async () => {
    const user = await createTestUser(['author']);
    const laptop = await signInWith(user.username, 'Laptop/4');
    const mine = (await sessionsOf(laptop)).find((s) => s.current)!;

    const res = await laptop.delete(`/api/auth/sessions/${mine.id}`);

    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/sign out/);
  });

  it("when someone names another person's session, then it is not found and that session goes on", async () => {
    const victim = await createTestUser(['approver']);
    const intruder = await createTestUser(['admin']);
    const victimSession = await signInWith(victim.username, 'Victim/1');
    const intruderSession = await signInWith(intruder.username, 'Intruder/1');
    const target = (await sessionsOf(victimSession))[0];

    expect((await intruderSession.delete(`/api/auth/sessions/${target.id}`)).status).toBe(404);
    expect((await sessionsOf(intruderSession)).map((s) => s.userAgent)).toEqual(['Intruder/1']);
    expect((await victimSession.get('/api/projects')).status).toBe(200);
  });

  it('when the session id is malformed, then it is a 400 naming it', async () => {
    const user = await createTestUser(['author']);
    const res = await (await signInWith(user.username, 'Laptop/5')).delete('/api/auth/sessions/not-an-id');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors)).toEqual(['params.id']);
  });
});

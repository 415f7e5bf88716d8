import request from 'supertest';
import { Session, User, UserRole } from '../../server/db/models';
import { sessionCookieOf, signedInAs, startTestApp } from '../support/api-harness';
import { capturedSelects } from '../support/explain-harness';
import { CLOCK_SLACK_MS } from '../support/wall-clock';

// An idle limit of 7 minutes: its deadlines are easy to tell from the default 30, and a slow sign-in on a busy
// machine stays inside it (1.2 s used to be chosen here, and a sign-in slower than that lost its own CSRF token).
const shortIdle = startTestApp({ SESSION_IDLE_MINUTES: 7 });
const IDLE_MS = 7 * 60_000;
const short = startTestApp({ SESSION_ABSOLUTE_HOURS: 0.5 });
const standard = startTestApp();
const HOUR = 3_600_000;
afterAll(async () => {
  for (const instance of [shortIdle, short, standard]) await instance.sequelize.close();
});

async function sessionRowOf(userId: number) {
  const row = await Session.findOne({ where: { userId } });
  if (!row) throw new Error(`no session row for user ${userId}`);
  return row;
}

async function backdateStart(userId: number, msAgo: number): Promise<void> {
  const row = await sessionRowOf(userId);
  const data = JSON.parse(row.data!);
  await row.update({ data: JSON.stringify({ ...data, startedAt: Date.now() - msAgo }) });
}

describe('idle timeout', () => {
  it('when the idle limit is 7 minutes, then the cookie and the session row expire 7 minutes after the answer', async () => {
    const sent = Date.now();
    const { user, session } = await signedInAs(shortIdle.app, ['author']);
    const received = Date.now();

    const expires = Date.parse(/Expires=([^;]+)/.exec(session.login.headers['set-cookie'][0])![1]);
    const row = await sessionRowOf(user.id);

    // Expires= has whole seconds and the wall clock may be stepped between readings, so the bounds are loose.
    expect(expires).toBeGreaterThanOrEqual(sent + IDLE_MS - CLOCK_SLACK_MS);
    expect(expires).toBeLessThanOrEqual(received + IDLE_MS + CLOCK_SLACK_MS);
    expect(row.expires!.getTime()).toBeLessThanOrEqual(received + IDLE_MS + CLOCK_SLACK_MS);
  });

  it('when the default idle limit applies, then the cookie lasts 30 minutes from each answer', async () => {
    const { session } = await signedInAs(standard.app, ['author']);
    const sent = Date.now();
    const res = await session.get('/api/session');
    const received = Date.now();
    const expires = Date.parse(/Expires=([^;]+)/.exec(res.headers['set-cookie'][0])![1]);
    // Bounded by when the request left and the answer came (whole seconds, a stepped clock), not by a guess at speed.
    expect(expires).toBeGreaterThanOrEqual(sent + 30 * 60_000 - CLOCK_SLACK_MS);
    expect(expires).toBeLessThanOrEqual(received + 30 * 60_000 + CLOCK_SLACK_MS);
  });

  it('when a request follows soon after the last renewal, then the row is not written again', async () => {
    const { user, session } = await signedInAs(standard.app, ['author']);
    // A row renewed "just now" as far as any answer in this test can tell: its deadline lies hours ahead of the one
    // an answer sets, however slowly the machine runs (no timing assumed).
    const row = await sessionRowOf(user.id);
    const ahead = new Date(row.expires!.getTime() + 6 * HOUR);
    await row.update({ expires: ahead });

    await session.get('/api/session').expect(200);

    // The default idle limit renews the row only once it lags by a minute (a tenth of 30 minutes, at most 60 s).
    expect((await sessionRowOf(user.id)).expires!.getTime()).toBe(ahead.getTime());
  });

  it('when the row lags the new deadline by more than the step, then a request renews it', async () => {
    const { user, session } = await signedInAs(standard.app, ['author']);
    const row = await sessionRowOf(user.id);
    await row.update({ expires: new Date(row.expires!.getTime() - 2 * 60_000) });

    const sent = Date.now();
    await session.get('/api/session').expect(200);

    expect((await sessionRowOf(user.id)).expires!.getTime()).toBeGreaterThanOrEqual(
      sent + 30 * 60_000 - CLOCK_SLACK_MS,
    );
  });

  it('when the idle limit has passed, then replaying the old cookie gets 401', async () => {
    const { user, session } = await signedInAs(shortIdle.app, ['author']);
    const cookie = sessionCookieOf(session.login);
    // The first test shows the row's expiry is the answer plus the idle limit; moving it back by the
    // limit is the state an idle limit later leaves, without waiting for the clock.
    const row = await sessionRowOf(user.id);
    await row.update({ expires: new Date(row.expires!.getTime() - IDLE_MS) });

    const res = await request(shortIdle.app).get('/api/projects').set('Cookie', cookie);

    expect(res.status).toBe(401);
  });

  it('when the session row has expired, then its cookie no longer signs anyone in', async () => {
    const { user, session } = await signedInAs(standard.app, ['author']);
    const cookie = sessionCookieOf(session.login);
    await (await sessionRowOf(user.id)).update({ expires: new Date(Date.now() - 1_000) });

    const res = await request(standard.app).get('/api/session').set('Cookie', cookie);

    expect(res.body.user).toBeNull();
  });
});

// Backdating the row's start time tests the absolute limit without waiting for hours.
describe('absolute limit', () => {
  it('when the session started 11 hours ago, then it is still good (the limit is 12)', async () => {
    const { user, session } = await signedInAs(standard.app, ['author']);
    await backdateStart(user.id, 11 * HOUR);
    expect((await session.get('/api/projects')).status).toBe(200);
  });

  it('when the session started 13 hours ago, then the next request gets 401 and the row is gone', async () => {
    const { user, session } = await signedInAs(standard.app, ['author']);
    const { sid } = await sessionRowOf(user.id);
    await backdateStart(user.id, 13 * HOUR);

    const res = await session.get('/api/projects');

    expect(res.status).toBe(401);
    expect(await Session.findByPk(sid)).toBeNull();
  });

  it('when the absolute limit is configured shorter, then it is honoured', async () => {
    const { user, session } = await signedInAs(short.app, ['author']);
    await backdateStart(user.id, 0.6 * HOUR);
    expect((await session.get('/api/projects')).status).toBe(401);
  });
});

describe('who is asking', () => {
  it('when a signed-in request arrives, then its session row and its person are read in one statement', async () => {
    const { user, session } = await signedInAs(standard.app, ['author', 'checker'], 'asking');
    let answer: request.Response | undefined;
    const selects = await capturedSelects(standard.sequelize, async () => {
      answer = await session.get('/api/session');
    });
    expect(answer!.body.user).toMatchObject({ id: user.id, username: user.username, roles: ['author', 'checker'] });
    // The session row joined to its person and roles; passport does not read the person again.
    expect(selects.filter((sql) => /\busers\b|\buser_roles\b/.test(sql))).toHaveLength(1);
  });

  it('when several people ask at once, then every answer names the person whose session asked', async () => {
    const people = await Promise.all([0, 1, 2, 3].map((i) => signedInAs(standard.app, ['author'], `asking-${i}`)));
    const asked = Array.from({ length: 40 }, (_, i) => people[i % people.length]);
    const answers = await Promise.all(asked.map(({ session }) => session.get('/api/session')));
    expect(answers.map((res) => res.body.user?.username)).toEqual(asked.map(({ user }) => user.username));
  });

  it('when the person a session names is made inactive behind the app, then the next request is signed out and the session no longer names them', async () => {
    const { user, session } = await signedInAs(standard.app, ['author'], 'gone-quiet');
    const { sid } = await sessionRowOf(user.id);
    // Straight in the table: no session of theirs is ended, as the app's own deactivation would.
    await User.update({ active: false }, { where: { id: user.id } });

    const res = await session.get('/api/session');
    const projects = await session.get('/api/projects');

    expect(res.body.user).toBeNull();
    expect(res.body.rules).toEqual([]);
    expect(projects.status).toBe(401);
    const row = await Session.findByPk(sid);
    expect(row).not.toBeNull();
    expect(row!.userId).toBeNull();
    expect(JSON.parse(row!.data!).passport).toEqual({});
  });

  it("when a person's roles change behind the app, then their next request is judged by the new roles", async () => {
    const { user, session } = await signedInAs(standard.app, ['author'], 'role-moved');
    expect((await session.get('/api/audit?size=1')).status).toBe(403);

    await UserRole.create({ userId: user.id, role: 'compliance' });
    const audit = await session.get('/api/audit?size=1');
    await UserRole.destroy({ where: { userId: user.id, role: 'compliance' } });
    const after = await session.get('/api/audit?size=1');

    expect(audit.status).toBe(200);
    expect(after.status).toBe(403);
  });
});

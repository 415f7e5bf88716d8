import { randomUUID } from 'node:crypto';
import { Op } from 'sequelize';
import { AuditEvent } from '../../server/db/models';
import {
  anonymousAgent,
  createTestUser,
  signedInAs,
  startTestApp,
  TEST_PASSWORD,
  uniqueCode,
} from '../support/api-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

// Read from the table itself: the API has no per-entity filter, and these checks need exact rows.
async function eventsFor(entityType: string, id: number) {
  const rows = await AuditEvent.findAll({ where: { entityType, entityId: String(id) }, order: [['id', 'ASC']] });
  return rows.map((r) => ({ action: r.action, actorId: r.actorId, payload: JSON.parse(r.payload) }));
}

async function attemptSignIn(username: string, password: string) {
  const { agent, token } = await anonymousAgent(app);
  return agent.post('/api/auth/login').set('x-csrf-token', token).send({ username, password });
}

describe('audit entries', () => {
  it('when someone signs in, then an auth.signed_in entry names them', async () => {
    const { user } = await signedInAs(app, ['author']);
    expect(await eventsFor('User', user.id)).toEqual([
      expect.objectContaining({ action: 'auth.signed_in', actorId: user.id }),
    ]);
  });

  // The client only ever sees the generic 401 (auth.spec.ts); the reason is kept for whoever investigates.
  it('when a sign-in fails, then the entry records the attempted username and why, for the auditor only', async () => {
    const user = await createTestUser(['author']);
    const ghost = `ghost-${randomUUID().slice(0, 8)}`;
    const since = (await AuditEvent.max<number, AuditEvent>('id')) ?? 0;

    await attemptSignIn(user.username, 'wrong password');
    await attemptSignIn(ghost, TEST_PASSWORD);

    const rows = await AuditEvent.findAll({ where: { id: { [Op.gt]: since }, action: 'auth.sign_in_failed' } });
    const payloads = rows.map((r) => JSON.parse(r.payload));
    expect(payloads).toEqual(
      expect.arrayContaining([
        { username: user.username, reason: 'password' },
        { username: ghost, reason: 'unknown user' },
      ]),
    );
  });

  it('when an admin creates, changes, deactivates and reactivates a user, then each step is an entry by that admin', async () => {
    const { user: admin, session } = await signedInAs(app, ['admin']);
    const username = `audited-${randomUUID().slice(0, 8)}`;
    const created = await session.post('/api/users', {
      username,
      displayName: 'Audited Person',
      email: 'a@example.test',
      roles: ['author'],
      initialPassword: TEST_PASSWORD,
    });
    const id = created.body.id;

    await session.patch(`/api/users/${id}`, { roles: ['author', 'checker'], version: 0 });
    await session.put(`/api/users/${id}/active`, { active: false });
    await session.put(`/api/users/${id}/active`, { active: true });

    const events = await eventsFor('User', id);
    // Signing roles are requested, not given: each waits for a second person (separation-of-duties.spec.ts).
    expect(events.map((e) => e.action)).toEqual([
      'user.created',
      'user.role_requested',
      'user.role_requested',
      'user.deactivated',
      'user.reactivated',
    ]);
    expect(events.every((e) => e.actorId === admin.id)).toBe(true);
    expect(events[1].payload).toMatchObject({ role: 'author', username });
    expect(events[2].payload).toMatchObject({ role: 'checker', username });
    expect(JSON.stringify(events[0].payload)).not.toContain(TEST_PASSWORD);
  });

  it('when an admin creates and changes a project, then both are entries with the before and after', async () => {
    const { session } = await signedInAs(app, ['admin']);
    const created = await session.post('/api/projects', { code: uniqueCode('AU'), name: 'Audited mixer shaft' });

    await session.patch(`/api/projects/${created.body.id}`, { name: 'Audited rename', version: 0 });

    const events = await eventsFor('Project', created.body.id);
    expect(events.map((e) => e.action)).toEqual(['project.created', 'project.updated']);
    expect(events[1].payload.before.name).toBe('Audited mixer shaft');
    expect(events[1].payload.after.name).toBe('Audited rename');
  });

  // A refused change must not look like a change to an auditor reading the trail.
  it('when a forbidden change is refused, then no entry is written', async () => {
    const { session } = await signedInAs(app, ['author']);
    const target = await createTestUser(['checker']);

    await session.put(`/api/users/${target.id}/active`, { active: false });

    expect(await eventsFor('User', target.id)).toEqual([]);
  });

  it('when compliance filters the trail by action, then only those entries come back', async () => {
    const { session } = await signedInAs(app, ['compliance']);
    const res = await session.get('/api/audit?action=auth.signed_in&size=5');
    expect(res.status).toBe(200);
    expect(res.body.items.length).toBeGreaterThan(0);
    expect(res.body.items.every((e: { action: string }) => e.action === 'auth.signed_in')).toBe(true);
  });
});

describe('audit chain', () => {
  it('when the chain is verified, then every row links to the one before', async () => {
    const { session } = await signedInAs(app, ['compliance']);

    const res = await session.get('/api/audit/verify');

    expect(res.status).toBe(200);
    expect(res.body).toEqual(expect.objectContaining({ ok: true, checked: expect.any(Number) }));
    expect(res.body.checked).toBeGreaterThan(0);
  });

  // The triggers guard against anyone with SQL access, not just the app, so raw SQL on the app's connection is the
  // test. Each first appends a row of its own and then touches that row by its key: other spec files append to the
  // same table at the same time, and "the last row" (ORDER BY id DESC LIMIT 1) locks the gap their inserts need,
  // which MariaDB may end as a deadlock before the trigger runs.
  async function appendOwnRow(): Promise<number> {
    const { username } = await createTestUser(['author']);
    await attemptSignIn(username, 'wrong password');
    // Found by the username it names, not among the newest failures: other spec files fail sign-ins too, as many as
    // they like while this runs.
    const rows = await AuditEvent.findAll({
      where: { action: 'auth.sign_in_failed', payload: { [Op.like]: `%${username}%` } },
    });
    const own = rows.find((r) => JSON.parse(r.payload).username === username);
    if (!own) throw new Error(`no sign-in failure entry for ${username}`);
    return own.id;
  }

  it('when anyone runs UPDATE on audit_events directly, then the database refuses', async () => {
    const id = await appendOwnRow();
    await expect(
      sequelize.query("UPDATE audit_events SET actor_name = 'someone else' WHERE id = ?", { replacements: [id] }),
    ).rejects.toThrow(/append-only/);
  });

  it('when anyone runs DELETE on audit_events directly, then the database refuses', async () => {
    const id = await appendOwnRow();
    await expect(sequelize.query('DELETE FROM audit_events WHERE id = ?', { replacements: [id] })).rejects.toThrow(
      /append-only/,
    );
  });
});

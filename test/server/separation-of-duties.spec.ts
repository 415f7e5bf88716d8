import { randomUUID } from 'node:crypto';
import { Op } from 'sequelize';
import { AuditEvent, MailOutbox, RoleGrant } from '../../server/db/models';
import { ROLES, type Role } from '../../shared/authz/roles';
import { createTestUser, signedInAs, startTestApp, TEST_PASSWORD, expectStatus, person } from '../support/api-harness';
import { advanceTo, createCalc, sign } from '../support/calc-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Session = Awaited<ReturnType<typeof signedInAs>>['session'];

async function versionOf(s: Session, id: number): Promise<number> {
  return (await s.get(`/api/users/${id}`)).body.version;
}

async function askFor(admin: Session, userId: number, roles: Role[]) {
  return admin.patch(`/api/users/${userId}`, { roles, version: await versionOf(admin, userId) });
}

async function pendingGrant(userId: number, role: Role): Promise<number> {
  const grant = await RoleGrant.findOne({ where: { userId, role, status: 'pending' } });
  if (!grant) throw new Error(`no pending ${role} request for user ${userId}`);
  return grant.id;
}

async function rolesAudited(userId: number): Promise<string[]> {
  const rows = await AuditEvent.findAll({
    where: { entityType: 'User', entityId: String(userId), action: { [Op.like]: 'user.role%' } },
    order: [['id', 'ASC']],
  });
  return rows.map((r) => `${r.action}:${JSON.parse(r.payload).role}`);
}

describe('nobody changes their own roles', () => {
  it.each(ROLES.map((r) => [r]))(
    'when a %s asks for different roles for themselves, then it is a 403 and nothing changes',
    async (role) => {
      const { user, session } = await signedInAs(app, [role]);
      const wanted: Role[] = [role, role === 'approver' ? 'checker' : 'approver'];

      const res = await session.patch(`/api/users/${user.id}`, { roles: wanted, version: 0 });

      expect(res.status).toBe(403);
      expect(await RoleGrant.count({ where: { userId: user.id } })).toBe(0);
      expect((await session.get('/api/session')).body.user.roles).toEqual([role]);
    },
  );

  it('when an admin gives themselves the approver role, then it is refused and they still cannot approve', async () => {
    const { user, session: admin } = await signedInAs(app, ['admin', 'checker']);
    const author = await person(app, ['author']);
    const checker = await person(app, ['checker']);
    const { revisionId } = await createCalc(author.session);
    await advanceTo('checked', { author: author.session, checker: checker.session, approver: admin }, revisionId).catch(
      () => undefined,
    );

    const res = await askFor(admin, user.id, ['admin', 'approver', 'checker']);

    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/Nobody changes their own roles/);
    expect((await sign(admin, revisionId, 'approved')).status).toBe(403);
  });

  it('when an admin keeps their own roles while renaming themselves, then that is allowed', async () => {
    const { user, session: admin } = await signedInAs(app, ['admin']);
    const res = await admin.patch(`/api/users/${user.id}`, {
      displayName: 'Renamed Admin',
      roles: ['admin'],
      version: 0,
    });
    expect(res.status).toBe(200);
  });
});

describe('a signing role waits for a second person', () => {
  it.each([['author'], ['checker'], ['approver']] as [Role][])(
    'when an admin gives someone the %s role, then it is pending until another admin confirms',
    async (role) => {
      const { session: asker } = await signedInAs(app, ['admin']);
      const { session: second } = await signedInAs(app, ['admin']);
      const grantee = await signedInAs(app, ['compliance']);

      const asked = expectStatus(await askFor(asker, grantee.user.id, ['compliance', role]), 200, 'ask');
      expect(asked.body).toEqual(expect.objectContaining({ roles: ['compliance'], pendingRoles: [role] }));
      expect((await grantee.session.get('/api/session')).body.user.roles).toEqual(['compliance']);
      const id = await pendingGrant(grantee.user.id, role);
      expect((await second.get('/api/role-grants')).body.map((g: { id: number }) => g.id)).toContain(id);

      expectStatus(await second.post(`/api/role-grants/${id}/confirm`, { password: TEST_PASSWORD }), 200, 'confirm');

      expect((await grantee.session.get('/api/session')).body.user.roles).toEqual(['compliance', role].sort());
      expect(await rolesAudited(grantee.user.id)).toEqual([`user.role_requested:${role}`, `user.role_granted:${role}`]);
    },
  );

  it('when an admin gives someone the admin or compliance role, then it takes effect at once and is audited', async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const target = await createTestUser(['author']);

    const res = expectStatus(await askFor(admin, target.id, ['author', 'compliance']), 200, 'grant');

    expect(res.body).toEqual(expect.objectContaining({ roles: ['author', 'compliance'], pendingRoles: [] }));
    expect(await rolesAudited(target.id)).toEqual(['user.role_granted:compliance']);
  });

  it('when the requester tries to confirm their own request, then it is a 403 and the role stays pending', async () => {
    const { session: asker } = await signedInAs(app, ['admin']);
    const target = await createTestUser(['author']);
    await askFor(asker, target.id, ['author', 'approver']);
    const id = await pendingGrant(target.id, 'approver');

    const res = await asker.post(`/api/role-grants/${id}/confirm`, { password: TEST_PASSWORD });

    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/second person/);
    expect((await RoleGrant.findByPk(id))!.status).toBe('pending');
  });

  it('when the grantee is an admin or compliance officer, then they cannot confirm their own grant', async () => {
    const { session: asker } = await signedInAs(app, ['admin']);
    const grantee = await signedInAs(app, ['admin', 'compliance']);
    await askFor(asker, grantee.user.id, ['admin', 'approver', 'compliance']);
    const id = await pendingGrant(grantee.user.id, 'approver');

    const res = await grantee.session.post(`/api/role-grants/${id}/confirm`, { password: TEST_PASSWORD });

    expect(res.status).toBe(403);
    expect((await grantee.session.get('/api/session')).body.user.roles).toEqual(['admin', 'compliance']);
  });

  it.each([['author'], ['checker'], ['approver']] as [Role][])(
    'when a %s tries to see or decide a request, then it is a 403',
    async (role) => {
      const { session: asker } = await signedInAs(app, ['admin']);
      const target = await createTestUser(['author']);
      await askFor(asker, target.id, ['author', 'checker']);
      const id = await pendingGrant(target.id, 'checker');
      const { session } = await signedInAs(app, [role]);

      expect((await session.get('/api/role-grants')).status).toBe(403);
      expect((await session.post(`/api/role-grants/${id}/confirm`, { password: TEST_PASSWORD })).status).toBe(403);
      expect((await session.post(`/api/role-grants/${id}/refuse`, { reason: 'not mine to decide' })).status).toBe(403);
      expect((await RoleGrant.findByPk(id))!.status).toBe('pending');
    },
  );

  it('when a compliance officer confirms with a wrong password, then it is a 400 and nothing is granted', async () => {
    const { session: asker } = await signedInAs(app, ['admin']);
    const { session: officer } = await signedInAs(app, ['compliance']);
    const target = await createTestUser(['checker']);
    await askFor(asker, target.id, ['checker', 'approver']);
    const id = await pendingGrant(target.id, 'approver');

    const res = await officer.post(`/api/role-grants/${id}/confirm`, { password: 'not my password' });

    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors)).toEqual(['password']);
    expect((await RoleGrant.findByPk(id))!.status).toBe('pending');
  });

  it('when a compliance officer refuses a request, then the role is never given and a second decision is a 409', async () => {
    const { session: asker } = await signedInAs(app, ['admin']);
    const { session: officer } = await signedInAs(app, ['compliance']);
    const target = await createTestUser(['checker']);
    await askFor(asker, target.id, ['checker', 'approver']);
    const id = await pendingGrant(target.id, 'approver');

    expectStatus(
      await officer.post(`/api/role-grants/${id}/refuse`, { reason: 'Not yet qualified to approve' }),
      200,
      'refuse',
    );

    expect((await officer.post(`/api/role-grants/${id}/confirm`, { password: TEST_PASSWORD })).status).toBe(409);
    expect((await asker.get(`/api/users/${target.id}`)).body).toEqual(
      expect.objectContaining({ roles: ['checker'], pendingRoles: [] }),
    );
    expect(await rolesAudited(target.id)).toEqual(['user.role_requested:approver', 'user.role_refused:approver']);
  });

  it('when a new account is created with signing roles, then they wait for confirmation too', async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const res = await admin.post('/api/users', {
      username: `fresh-${randomUUID().slice(0, 8)}`,
      displayName: 'Fresh Account',
      email: 'fresh@example.test',
      roles: ['approver'],
      initialPassword: TEST_PASSWORD,
    });
    expect(res.status).toBe(201);
    expect(res.body).toEqual(expect.objectContaining({ roles: [], pendingRoles: ['approver'] }));
  });
});

describe('role changes reach the compliance officers', () => {
  it('when a role is asked for, given and removed, then each is mailed to every compliance officer', async () => {
    const officer = await createTestUser(['compliance'], 'officer');
    const { session: asker } = await signedInAs(app, ['admin']);
    const { session: second } = await signedInAs(app, ['admin']);
    const target = await createTestUser(['author']);
    const since = (await MailOutbox.max<number, MailOutbox>('id')) ?? 0;

    await askFor(asker, target.id, ['author', 'checker']);
    await second.post(`/api/role-grants/${await pendingGrant(target.id, 'checker')}/confirm`, {
      password: TEST_PASSWORD,
    });
    await askFor(asker, target.id, ['checker']);

    // Every compliance officer hears of every role change, so other spec files sharing the database can mail this
    // officer about their own users while this runs; only the mail about this target is judged.
    const mails = (
      await MailOutbox.findAll({
        where: { id: { [Op.gt]: since }, recipient: `${officer.username}@example.test` },
        order: [['id', 'ASC']],
      })
    ).filter((m) => m.body.includes(target.username));
    expect(mails.map((m) => m.subject.split(':')[0])).toEqual(['Role requested', 'Role granted', 'Role removed']);
    expect(mails.every((m) => m.event === 'role_change')).toBe(true);
    expect(await rolesAudited(target.id)).toEqual([
      'user.role_requested:checker',
      'user.role_granted:checker',
      'user.role_removed:author',
    ]);
  });
});

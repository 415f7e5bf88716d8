import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { Op } from 'sequelize';
import { AuditEvent } from '../../server/db/models';
import { verifyAuditChain } from '../../server/audit/audit.service';
import { anonymousAgent, createTestUser, startTestApp, TEST_PASSWORD } from '../support/api-harness';

// Addresses on the audit trail: whatever a client puts in X-Forwarded-For, an audited request never
// fails on it, and a sign-in is never left without its audit entry.
const { app, sequelize } = startTestApp({ TRUST_PROXY: 'loopback' });
afterAll(() => sequelize.close());

async function signIn(username: string, forwardedFor?: string) {
  const { agent, token } = await anonymousAgent(app);
  let req = agent.post('/api/auth/login').set('x-csrf-token', token);
  if (forwardedFor) req = req.set('X-Forwarded-For', forwardedFor);
  return { agent, res: await req.send({ username, password: TEST_PASSWORD }) };
}

const signInEntries = (userId: number) =>
  AuditEvent.findAll({ where: { action: 'auth.signed_in', entityId: String(userId) } });

describe('audit addresses', () => {
  it.each([
    ['a 5,000-character X-Forwarded-For', 'x'.repeat(5000), '127.0.0.1'],
    ['an IPv6 address with a long zone id', `fe80::1%${'z'.repeat(200)}`, `fe80::1%${'z'.repeat(200)}`],
    ['an IPv4-mapped IPv6 address', '::ffff:192.0.2.44', '::ffff:192.0.2.44'],
    ['an address over the column width', `fe80::1%${'z'.repeat(300)}`, '127.0.0.1'],
  ])(
    'when a sign-in comes with %s, then it succeeds and its audit entry records an address that fits',
    async (_what, header, recorded) => {
      const user = await createTestUser(['author']);
      const { res } = await signIn(user.username, header);
      expect(res.status).toBe(200);
      const entries = await signInEntries(user.id);
      expect(entries.map((e) => e.ip?.replace(/^::ffff:(?=127\.)/, ''))).toEqual([recorded]);
    },
  );

  it('when a failed sign-in comes with a long X-Forwarded-For, then it is a 401 with its audit entry', async () => {
    const { agent, token } = await anonymousAgent(app);
    const name = `nobody-${randomUUID().slice(0, 8)}`;
    const res = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', token)
      .set('X-Forwarded-For', 'y'.repeat(3000))
      .send({ username: name, password: 'wrong password' });
    expect(res.status).toBe(401);
    const rows = await AuditEvent.findAll({
      where: { action: 'auth.sign_in_failed', payload: { [Op.like]: `%${name}%` } },
    });
    expect(rows).toHaveLength(1);
  });
});

describe('a sign-in that cannot be audited', () => {
  const trigger = `tt_refuse_audit_${process.pid}`;
  afterAll(() => sequelize.query(`DROP TRIGGER IF EXISTS ${trigger}`));

  it('when the audit entry cannot be written, then the sign-in fails and the person is not signed in', async () => {
    const user = await createTestUser(['author'], 'unaudited');
    // Refuses audit rows for this one person only, so specs running beside this one are unaffected.
    await sequelize.query(`CREATE TRIGGER ${trigger} BEFORE INSERT ON audit_events FOR EACH ROW
      BEGIN IF NEW.action = 'auth.signed_in' AND NEW.entity_id = '${user.id}' THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit refused by test'; END IF; END`);
    const { agent, res } = await signIn(user.username);
    await sequelize.query(`DROP TRIGGER ${trigger}`);
    expect(res.status).toBeGreaterThanOrEqual(500);
    expect(JSON.stringify(res.body)).not.toMatch(/audit refused|\.ts:\d+/);
    expect((await agent.get('/api/session')).body.user).toBeNull();
    expect(await signInEntries(user.id)).toHaveLength(0);
    // The same person signs in normally once the trail accepts entries again.
    expect((await signIn(user.username)).res.status).toBe(200);
    expect(await signInEntries(user.id)).toHaveLength(1);
    expect((await verifyAuditChain()).ok).toBe(true);
  });

  it('when nobody is signed in, then a long X-Forwarded-For on an audited write is still not a 500', async () => {
    const res = await request(app).post('/api/auth/logout').set('X-Forwarded-For', 'z'.repeat(4000));
    expect(res.status).toBeLessThan(500);
  });
});

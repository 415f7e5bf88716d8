import type { Express } from 'express';
import { AuditEvent } from '../../server/db/models';
import { anonymousAgent, createTestUser, signedInAgent, startTestApp, TEST_PASSWORD } from '../support/api-harness';

// Default configuration: no proxy is trusted, so X-Forwarded-For is only a header anyone can write.
const plain = startTestApp({ LOGIN_RATE_LIMIT: 3 });
// A deployment behind a balancer on loopback names it, and only then is the header believed.
const proxied = startTestApp({ LOGIN_RATE_LIMIT: 3, TRUST_PROXY: 'loopback' });
afterAll(async () => {
  await plain.sequelize.close();
  await proxied.sequelize.close();
});

async function attempt(app: Express, username: string, forwardedFor: string, password = 'not the password') {
  const { agent, token } = await anonymousAgent(app);
  return agent
    .post('/api/auth/login')
    .set('x-csrf-token', token)
    .set('x-forwarded-for', forwardedFor)
    .send({ username, password });
}

async function lastSignInIp(userId: number): Promise<string | null> {
  const row = await AuditEvent.findOne({
    where: { action: 'auth.signed_in', actorId: userId },
    order: [['id', 'DESC']],
  });
  if (!row) throw new Error(`no sign-in recorded for user ${userId}`);
  return row.ip;
}

describe('X-Forwarded-For with the default configuration', () => {
  it('when each failed attempt claims a new address, then they still count against one limit', async () => {
    const user = await createTestUser(['author']);
    for (let i = 0; i < 3; i++)
      expect((await attempt(plain.app, user.username, `203.0.113.${i + 1}`)).status).toBe(401);

    const res = await attempt(plain.app, user.username, '198.51.100.77', TEST_PASSWORD);

    expect(res.status).toBe(429);
  });

  it('when a sign-in claims another address, then the audit trail records the real one', async () => {
    const user = await createTestUser(['checker']);
    const { agent, token } = await anonymousAgent(plain.app);

    const res = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', token)
      .set('x-forwarded-for', '198.51.100.9')
      .send({ username: user.username, password: TEST_PASSWORD });

    expect(res.status).toBe(200);
    expect(await lastSignInIp(user.id)).toMatch(/^(::ffff:)?127\.0\.0\.1$|^::1$/);
  });
});

describe('X-Forwarded-For with TRUST_PROXY naming the balancer', () => {
  it('when the trusted balancer forwards a client address, then the audit trail records it', async () => {
    const user = await createTestUser(['approver']);
    const { agent, token } = await anonymousAgent(proxied.app);

    await agent
      .post('/api/auth/login')
      .set('x-csrf-token', token)
      .set('x-forwarded-for', '198.51.100.10')
      .send({ username: user.username, password: TEST_PASSWORD })
      .expect(200);

    expect(await lastSignInIp(user.id)).toBe('198.51.100.10');
  });

  it('when attempts come from different forwarded clients, then each client has its own limit', async () => {
    const user = await createTestUser(['author']);
    for (let i = 0; i < 3; i++) await attempt(proxied.app, user.username, '203.0.113.50');

    await expect(signedInAgent(proxied.app, user.username)).resolves.toBeDefined();
  });
});

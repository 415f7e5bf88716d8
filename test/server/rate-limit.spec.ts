import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import type { Options } from 'express-rate-limit';
import { MariaDbRateLimitStore } from '../../server/auth/rate-limit-store';
import { anonymousAgent, createTestUser, signedInAgent, startTestApp, TEST_PASSWORD } from '../support/api-harness';
import { CLOCK_SLACK_MS } from '../support/wall-clock';

// Two app instances on two connection pools, as behind a load balancer: they share only MariaDB.
const first = startTestApp({ LOGIN_RATE_LIMIT: 3 });
const second = startTestApp({ LOGIN_RATE_LIMIT: 3 });
afterAll(async () => {
  await first.sequelize.close();
  await second.sequelize.close();
});

async function attempt(app: Express, username: string, password = 'not the password') {
  const { agent, token } = await anonymousAgent(app);
  return agent.post('/api/auth/login').set('x-csrf-token', token).send({ username, password });
}

// Every test signs in as a fresh user: the counts live in MariaDB and outlast a test run.
describe('login rate limit', () => {
  it('when an account has used up its attempts, then even the right password gets 429', async () => {
    const user = await createTestUser(['author']);
    for (let i = 0; i < 3; i++) expect((await attempt(first.app, user.username)).status).toBe(401);

    const res = await attempt(first.app, user.username, TEST_PASSWORD);

    expect(res.status).toBe(429);
    expect(res.body).toEqual({ code: 'rate_limited', message: expect.stringMatching(/Too many sign-in attempts/) });
    expect(res.headers['ratelimit-policy']).toBeDefined();
  });

  it('when one account is limited, then another account from the same address can still sign in', async () => {
    const victim = await createTestUser(['author']);
    const colleague = await createTestUser(['checker']);
    for (let i = 0; i < 4; i++) await attempt(first.app, victim.username);

    await expect(signedInAgent(first.app, colleague.username)).resolves.toBeDefined();
  });

  it('when attempts are spread over two app instances, then they count against one limit', async () => {
    const user = await createTestUser(['author']);
    await attempt(first.app, user.username);
    await attempt(second.app, user.username);
    await attempt(first.app, user.username);

    const res = await attempt(second.app, user.username, TEST_PASSWORD);

    expect(res.status).toBe(429);
  });

  it('when an unknown username is tried repeatedly, then it is limited like a real one', async () => {
    const ghost = `ghost-${randomUUID().slice(0, 8)}`;
    const statuses = [];
    for (let i = 0; i < 4; i++) statuses.push((await attempt(second.app, ghost)).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
  });
});

describe('MariaDB rate-limit store', () => {
  const newStore = (windowMs = 60_000) => {
    const store = new MariaDbRateLimitStore(first.sequelize, { prefix: `test-${randomUUID().slice(0, 8)}:` });
    store.init({ windowMs } as Options);
    return store;
  };

  it('when a key is incremented, then the count rises and the reset time lies one window ahead', async () => {
    const store = newStore();
    const before = Date.now();

    await store.increment('k');
    const info = await store.increment('k');
    const after = Date.now();

    expect(info.totalHits).toBe(2);
    // The window starts at the first hit, somewhere between the two readings of this process's clock however long the
    // hits took on a busy machine; the database measures it on its own clock, so the bounds are loose either way.
    expect(info.resetTime!.getTime()).toBeGreaterThanOrEqual(before + 60_000 - CLOCK_SLACK_MS);
    expect(info.resetTime!.getTime()).toBeLessThanOrEqual(after + 60_000 + CLOCK_SLACK_MS);
  });

  it('when two instances of the store increment the same key at once, then no hit is lost', async () => {
    const prefix = `test-${randomUUID().slice(0, 8)}:`;
    const a = new MariaDbRateLimitStore(first.sequelize, { prefix });
    const b = new MariaDbRateLimitStore(second.sequelize, { prefix });

    const results = await Promise.all([...Array(10)].map((_, i) => (i % 2 ? a : b).increment('k')));

    expect(results.map((r) => r.totalHits).sort((x, y) => x - y)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
  });

  it('when a key is decremented or reset, then the count follows', async () => {
    const store = newStore();
    await store.increment('k');
    await store.increment('k');

    await store.decrement('k');
    const afterDecrement = await store.get('k');
    await store.resetKey('k');

    expect(afterDecrement?.totalHits).toBe(1);
    expect(await store.get('k')).toBeUndefined();
  });

  it('when a window has ended, then the next hit starts a new count', async () => {
    const store = newStore();
    await store.increment('k');
    await store.increment('k');
    await first.sequelize.query(
      'UPDATE rate_limit_hits SET reset_at = UTC_TIMESTAMP(3) - INTERVAL 1 SECOND WHERE rate_key = :key',
      {
        replacements: { key: `${store.prefix}k` },
      },
    );

    expect(await store.get('k')).toBeUndefined();
    expect((await store.increment('k')).totalHits).toBe(1);
  });

  it('when a key is longer than the column, then it is hashed and still counted', async () => {
    const store = newStore();
    const long = 'x'.repeat(5000);
    await store.increment(long);
    expect((await store.increment(long)).totalHits).toBe(2);
  });

  it('when the sweep of expired rows fails, then the hit that ran it is still counted', async () => {
    // The sweep runs on every hundredth hit; here the database refuses it as it would after a deadlock retried in vain.
    const refusing = new Proxy(first.sequelize, {
      get(target, name, receiver) {
        if (name !== 'query') return Reflect.get(target, name, receiver);
        return (sql: string, ...rest: unknown[]) =>
          /^DELETE FROM rate_limit_hits WHERE reset_at/.test(sql)
            ? Promise.reject(new Error('sweep refused by test'))
            : (target.query as (...a: unknown[]) => Promise<unknown>).call(target, sql, ...rest);
      },
    });
    const store = new MariaDbRateLimitStore(refusing, { prefix: `test-${randomUUID().slice(0, 8)}:` });
    store.init({ windowMs: 60_000 } as Options);

    const hits = [];
    for (let i = 0; i < 100; i++) hits.push((await store.increment('k')).totalHits);

    expect(hits.at(-1)).toBe(100);
  });
});

import { randomUUID } from 'node:crypto';
import { authenticator } from 'otplib';
import { TEST_PASSWORD, signedInAs, startTestApp } from '../support/api-harness';
import { calcTeam } from '../support/calc-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

async function enrol(session: Awaited<ReturnType<typeof signedInAs>>['session']) {
  const begun = await session.post('/api/auth/second-factor/begin');
  expect(begun.body.qrDataUrl).toMatch(/^data:image\/png;base64,/);
  const confirmed = await session.post('/api/auth/second-factor/confirm', {
    code: authenticator.generate(begun.body.secret),
  });
  expect(confirmed.body).toEqual({ enrolled: true, required: false });
  return begun.body.secret as string;
}

async function signBody(session: Awaited<ReturnType<typeof signedInAs>>['session'], id: number, extra: object = {}) {
  const r = (await session.get(`/api/revisions/${id}`)).body;
  return {
    password: TEST_PASSWORD,
    meaning: 'authored',
    idempotencyKey: randomUUID(),
    lockVersion: r.lockVersion,
    ...extra,
  };
}

describe('one-time codes for signatures (RFC 6238)', () => {
  it('when a wrong code confirms the enrolment, then nothing is stored', async () => {
    const { session } = await signedInAs(app, ['author']);
    await session.post('/api/auth/second-factor/begin');
    const res = await session.post('/api/auth/second-factor/confirm', { code: '000000' });
    expect(res.status).toBe(400);
    expect((await session.get('/api/auth/second-factor')).body.enrolled).toBe(false);
  });

  it('when an enrolled author signs, then the code is required and checked', async () => {
    const { author, revisionId } = await calcTeam(app);
    const secret = await enrol(author.session);

    const missing = await author.session.post(
      `/api/revisions/${revisionId}/sign`,
      await signBody(author.session, revisionId),
    );
    const wrong = await author.session.post(
      `/api/revisions/${revisionId}/sign`,
      await signBody(author.session, revisionId, { oneTimeCode: '123456' }),
    );
    const right = await author.session.post(
      `/api/revisions/${revisionId}/sign`,
      await signBody(author.session, revisionId, { oneTimeCode: authenticator.generate(secret) }),
    );

    expect(missing.status).toBe(400);
    expect(missing.body.fieldErrors.oneTimeCode).toBeDefined();
    expect(wrong.body.fieldErrors.oneTimeCode[0]).toMatch(/not correct/);
    expect(right.status).toBe(200);
    expect(right.body.status).toBe('in_check');
  });

  it('when an admin requires a code from someone not enrolled, then their signing is refused until they enrol', async () => {
    const { author, revisionId } = await calcTeam(app);
    const { session: admin } = await signedInAs(app, ['admin']);
    const me = (await author.session.get('/api/session')).body.user;
    const user = (await admin.get(`/api/users/${me.id}`)).body;
    const set = await admin.patch(`/api/users/${me.id}`, { secondFactorRequired: true, version: user.version });
    expect(set.body.secondFactorRequired).toBe(true);

    const refused = await author.session.post(
      `/api/revisions/${revisionId}/sign`,
      await signBody(author.session, revisionId),
    );

    expect(refused.status).toBe(403);
    expect(refused.body.message).toMatch(/enrol/);
    expect((await author.session.get('/api/auth/second-factor')).body.required).toBe(true);
  });
});

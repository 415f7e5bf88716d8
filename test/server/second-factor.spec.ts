import { randomUUID } from 'node:crypto';
import { authenticator } from 'otplib';
import { TEST_PASSWORD, signedInAs, startTestApp } from '../support/api-harness';
import { auditOf, lastAuditId } from '../support/audit-harness';
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

type Session = Awaited<ReturnType<typeof signedInAs>>['session'];
const attempt = async (session: Session, id: number, extra: object = {}) =>
  session.post(`/api/revisions/${id}/sign`, await signBody(session, id, extra));

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

    const missing = await attempt(author.session, revisionId);
    const wrong = await attempt(author.session, revisionId, { oneTimeCode: '123456' });
    const right = await attempt(author.session, revisionId, { oneTimeCode: authenticator.generate(secret) });

    expect(missing.status).toBe(400);
    expect(missing.body.fieldErrors.oneTimeCode[0]).toMatch(/^is required/);
    expect(wrong.body.fieldErrors.oneTimeCode[0]).toMatch(/not correct/);
    expect(right.status).toBe(200);
    expect(right.body.status).toBe('in_check');
  });

  it('when a code is missing and then wrong, then each is refused with its own reason, message and count', async () => {
    // Arrange
    const { author, project, revisionId } = await calcTeam(app);
    await enrol(author.session);
    const { session: compliance } = await signedInAs(app, ['compliance']);
    const since = await lastAuditId();
    // The days (UTC) the attempts fall in, read before and after them: a run that passes midnight spans two.
    const day = () => new Date().toISOString().slice(0, 10);
    const from = day();

    // Act
    const missing = await attempt(author.session, revisionId);
    const wrong = await attempt(author.session, revisionId, { oneTimeCode: '123456' });
    const health = await compliance.get(`/api/review-health?projectId=${project.id}&from=${from}&to=${day()}`);

    // Assert
    expect([missing.status, wrong.status]).toEqual([400, 400]);
    expect(missing.body.message).toBe(
      'One-time code is required: enter the 6 digits your authenticator app shows; nothing was signed',
    );
    expect(wrong.body.message).toBe('One-time code is not correct or has expired; nothing was signed');
    const refusals = (await auditOf('Revision', revisionId, since)).filter(
      (e) => e.action === 'revision.signature_refused',
    );
    expect(refusals.map((e) => e.payload.reason)).toEqual(['one-time code missing', 'one-time code wrong']);
    const rows = health.body.signals.find((s: { key: string }) => s.key === 'refusals').rows;
    expect(rows.map((r: { fact: string }) => r.fact)).toEqual([
      expect.stringMatching(/^2 signing attempts refused \(one-time code missing ×1, one-time code wrong ×1\)/),
    ]);
  });

  it('when an admin requires a code from someone not enrolled, then their signing is refused until they enrol', async () => {
    const { author, revisionId } = await calcTeam(app);
    const { session: admin } = await signedInAs(app, ['admin']);
    const me = (await author.session.get('/api/session')).body.user;
    const user = (await admin.get(`/api/users/${me.id}`)).body;
    const set = await admin.patch(`/api/users/${me.id}`, { secondFactorRequired: true, version: user.version });
    expect(set.body.secondFactorRequired).toBe(true);
    const since = await lastAuditId();

    const refused = await attempt(author.session, revisionId);

    expect(refused.status).toBe(403);
    expect(refused.body.message).toMatch(/enrol/);
    expect((await auditOf('Revision', revisionId, since)).map((e) => [e.action, e.payload.reason])).toEqual([
      ['revision.signature_refused', 'one-time code not set up'],
    ]);
    expect((await author.session.get('/api/auth/second-factor')).body.required).toBe(true);
  });
});

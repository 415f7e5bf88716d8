import { randomUUID } from 'node:crypto';
import { startTestApp, TEST_PASSWORD, expectStatus, person } from '../support/api-harness';
import { advanceTo, createCalc, revisionOf, sign, tickAll, type Team } from '../support/calc-harness';
import { mailAbout } from '../support/mail-harness';
import type { Role } from '../../shared/authz/roles';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

/**
 * Hand-over mail as the outbox records it (delivery is mail.spec.ts's subject). Every test user is
 * active with a unique address, and each calc has a project of its own whose code is in every
 * subject, so the rows about one calc are exactly the rows naming its project.
 */
async function team(roles: { author?: Role[]; checker?: Role[]; approver?: Role[] } = {}) {
  const author = await person(app, roles.author ?? ['author'], 'author');
  const checker = await person(app, roles.checker ?? ['checker'], 'checker');
  const approver = await person(app, roles.approver ?? ['approver'], 'approver');
  const sessions: Team = { author: author.session, checker: checker.session, approver: approver.session };
  return { author, checker, approver, sessions, ...(await createCalc(author.session)) };
}

const recipients = async (projectCode: string, event: string) =>
  (await mailAbout(projectCode, event)).map((m) => m.recipient);

describe('who hears of each hand-over', () => {
  it('when a calc is submitted, then checkers are told, but not its author+checker who wrote it, and no approver', async () => {
    // Arrange
    const t = await team({ author: ['author', 'checker'] });

    // Act
    await advanceTo('in_check', t.sessions, t.revisionId);

    // Assert
    const to = await recipients(t.project.code, 'submitted');
    expect(to).toContain(t.checker.email);
    expect(to).not.toContain(t.author.email);
    expect(to).not.toContain(t.approver.email);
    expect(new Set(to).size).toBe(to.length);
    const [mail] = await mailAbout(t.project.code, 'submitted');
    expect(mail.subject).toBe(`Ready for check: ${t.project.code} ${t.calc.number} rev A — Test head shaft`);
    expect(mail.status).toBe('pending');
  });

  it('when a calc is checked, then approvers are told, but not the checker+approver who checked it, nor its author', async () => {
    // Arrange
    const t = await team({ checker: ['checker', 'approver'] });

    // Act
    await advanceTo('checked', t.sessions, t.revisionId);

    // Assert
    const to = await recipients(t.project.code, 'checked');
    expect(to).toContain(t.approver.email);
    expect(to).not.toContain(t.checker.email);
    expect(to).not.toContain(t.author.email);
  });

  it('when a calc is returned, then only its author is told, with the reason', async () => {
    // Arrange
    const t = await team();
    await advanceTo('in_check', t.sessions, t.revisionId);

    // Act
    await t.checker.session.post(`/api/revisions/${t.revisionId}/return`, {
      reason: 'Use the certified Sy',
      lockVersion: (await revisionOf(t.author.session, t.revisionId)).lockVersion,
    });

    // Assert
    const mails = await mailAbout(t.project.code, 'returned');
    expect(mails.map((m) => m.recipient)).toEqual([t.author.email]);
    expect(mails[0].body).toContain('Reason: Use the certified Sy');
    expect(mails[0].body).toContain(`By: ${t.checker.displayName}`);
  });

  it('when a calc is approved, then only its author is told', async () => {
    // Arrange
    const t = await team();
    await advanceTo('checked', t.sessions, t.revisionId);

    // Act
    expectStatus(await sign(t.approver.session, t.revisionId, 'approved'), 200, 'approve');

    // Assert
    expect(await recipients(t.project.code, 'approved')).toEqual([t.author.email]);
  });

  it('when a calc goes all the way, then the outbox holds one batch per hand-over, in order', async () => {
    // Arrange
    const t = await team();

    // Act
    await advanceTo('approved', t.sessions, t.revisionId);

    // Assert
    const events = (await mailAbout(t.project.code)).map((m) => m.event);
    expect([...new Set(events)]).toEqual(['submitted', 'checked', 'approved']);
    expect(events.filter((e) => e === 'approved')).toHaveLength(1);
  });
});

describe('a hand-over that fails writes no mail', () => {
  it.each([
    [
      'the password is wrong',
      async (t: Awaited<ReturnType<typeof team>>) =>
        sign(t.author.session, t.revisionId, 'authored', { password: 'not my password' }),
      400,
    ],
    [
      'the signer may not sign',
      async (t: Awaited<ReturnType<typeof team>>) => sign(t.checker.session, t.revisionId, 'authored'),
      403,
    ],
    [
      'the lockVersion is stale',
      async (t: Awaited<ReturnType<typeof team>>) =>
        t.author.session.post(`/api/revisions/${t.revisionId}/sign`, {
          password: TEST_PASSWORD,
          meaning: 'authored',
          idempotencyKey: randomUUID(),
          lockVersion: 99,
        }),
      409,
    ],
  ])('when a submission fails because %s, then no mail is queued', async (_why, act, status) => {
    // Arrange
    const t = await team();

    // Act
    const res = await act(t);

    // Assert
    expect(res.status).toBe(status);
    expect(await mailAbout(t.project.code)).toEqual([]);
  });

  it('when a return fails on a stale lockVersion, then the author is not told', async () => {
    // Arrange
    const t = await team();
    await advanceTo('in_check', t.sessions, t.revisionId);

    // Act
    const res = await t.checker.session.post(`/api/revisions/${t.revisionId}/return`, {
      reason: 'Use the certified Sy',
      lockVersion: 99,
    });

    // Assert
    expect(res.status).toBe(409);
    expect(await mailAbout(t.project.code, 'returned')).toEqual([]);
  });

  it('when approval is refused for an unclosed finding, then the author is not told', async () => {
    // Arrange
    const t = await team();
    await advanceTo('in_check', t.sessions, t.revisionId);
    const returned = await t.checker.session.post(`/api/revisions/${t.revisionId}/return`, {
      reason: 'Cite the chart',
      lockVersion: 0,
    });
    await t.author.session.post(`/api/findings/${returned.body.findings[0].id}/answer`, { answer: 'Peterson 3.2' });
    expectStatus(await sign(t.author.session, t.revisionId, 'authored'), 200, 'resubmit');
    await tickAll(t.checker.session, t.revisionId);
    expectStatus(await sign(t.checker.session, t.revisionId, 'checked'), 200, 'check');

    // Act
    const res = await sign(t.approver.session, t.revisionId, 'approved');

    // Assert
    expect(res.status).toBe(403);
    expect(await mailAbout(t.project.code, 'approved')).toEqual([]);
  });
});

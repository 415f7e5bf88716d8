import { startTestApp } from '../support/api-harness';
import { advanceTo, revisionOf, sign, tickAll } from '../support/calc-harness';
import { auditOf, lastAuditId } from '../support/audit-harness';
import { findingsTeam, returnedWithFindingOf } from '../support/findings-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

const team = () => findingsTeam(app);
const returnedWithFinding = () => returnedWithFindingOf(app);

describe('raising findings', () => {
  it('when the checker raises a finding during check, then it is open, on record, and blocks signing as checked', async () => {
    // Arrange
    const t = await team();
    await advanceTo('in_check', t.sessions, t.revisionId);
    await tickAll(t.checker.session, t.revisionId);
    const since = await lastAuditId();

    // Act
    const raised = await t.checker.session.post(`/api/revisions/${t.revisionId}/findings`, {
      text: 'Fillet r/d is at the limit',
      clauseRef: '6.1',
    });
    const check = await sign(t.checker.session, t.revisionId, 'checked');

    // Assert
    expect(raised.status).toBe(201);
    expect(raised.body.findings).toEqual([
      expect.objectContaining({
        text: 'Fillet r/d is at the limit',
        clauseRef: '6.1',
        status: 'open',
        raisedBy: { id: t.checker.user.id, name: t.checker.displayName },
      }),
    ]);
    expect(check.status).toBe(403);
    expect(check.body.message).toMatch(/Open findings remain: return the calc to its author instead/);
    expect((await auditOf('Revision', t.revisionId, since)).map((e) => e.action)).toEqual(['finding.raised']);
  });

  it.each([
    ['the author', 'in check', 'author'],
    ['a checker', 'draft', 'checker'],
    ['an approver', 'in check', 'approver'],
  ] as const)(
    'when %s raises a finding while the revision is %s, then it is refused with 403',
    async (_who, state, role) => {
      // Arrange
      const t = await team();
      if (state !== 'draft') await advanceTo('in_check', t.sessions, t.revisionId);

      // Act
      const res = await t.sessions[role].post(`/api/revisions/${t.revisionId}/findings`, { text: 'Something is off' });

      // Assert
      expect(res.status).toBe(403);
      expect(res.body.message).toMatch(
        /Only an independent checker or approver reviewing this revision can raise findings/,
      );
      expect((await revisionOf(t.sessions.author, t.revisionId)).findings).toEqual([]);
    },
  );

  it('when the approver raises a finding on a checked revision, then it is accepted', async () => {
    // Arrange
    const t = await team();
    await advanceTo('checked', t.sessions, t.revisionId);

    // Act
    const res = await t.approver.session.post(`/api/revisions/${t.revisionId}/findings`, {
      text: 'Reliability should be 99.9 %',
    });

    // Assert
    expect(res.status).toBe(201);
    expect(res.body.findings[0]).toEqual(
      expect.objectContaining({ status: 'open', raisedBy: { id: t.approver.user.id, name: t.approver.displayName } }),
    );
  });

  it('when a finding has no text, then it is refused with 400 naming text', async () => {
    // Arrange
    const t = await team();
    await advanceTo('in_check', t.sessions, t.revisionId);

    // Act
    const res = await t.checker.session.post(`/api/revisions/${t.revisionId}/findings`, { text: '' });

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors.text).toBeDefined();
  });
});

describe('answering and closing', () => {
  it('when the author tries to resubmit with an open finding, then it is refused until the finding is answered', async () => {
    // Arrange
    const t = await returnedWithFinding();

    // Act
    const early = await sign(t.author.session, t.revisionId, 'authored');
    const answered = await t.author.session.post(`/api/findings/${t.findingId}/answer`, {
      answer: 'Peterson chart 3.2, now cited in the notes',
    });
    const resubmitted = await sign(t.author.session, t.revisionId, 'authored');

    // Assert
    expect(early.status).toBe(403);
    expect(early.body.message).toMatch(/Answer the 1 open finding\(s\) before resubmitting/);
    expect(answered.status).toBe(200);
    expect(answered.body.findings[0]).toEqual(
      expect.objectContaining({
        status: 'answered',
        answer: 'Peterson chart 3.2, now cited in the notes',
        answeredBy: { id: t.author.user.id, name: t.author.displayName },
      }),
    );
    expect(resubmitted.status).toBe(200);
    expect(resubmitted.body.status).toBe('in_check');
  });

  it('when the author answers the same finding twice at once, then one answer is stored and the other is refused with 409', async () => {
    // Arrange
    const t = await returnedWithFinding();
    const since = await lastAuditId();

    // Act
    const both = await Promise.all(
      ['First answer: chart cited', 'Second answer from another tab'].map((answer) =>
        t.author.session.post(`/api/findings/${t.findingId}/answer`, { answer }),
      ),
    );

    // Assert
    expect(both.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(both.find((r) => r.status === 409)!.body.message).toMatch(
      new RegExp(`Finding F${t.findingId} is already answered`),
    );
    expect((await auditOf('Revision', t.revisionId, since)).map((e) => e.action)).toEqual(['finding.answered']);
  });

  it.each(['checker', 'approver'] as const)(
    'when the %s answers a finding, then it is refused with 403',
    async (role) => {
      // Arrange
      const t = await returnedWithFinding();

      // Act
      const res = await t.sessions[role].post(`/api/findings/${t.findingId}/answer`, {
        answer: 'I will answer for the author',
      });

      // Assert
      expect(res.status).toBe(403);
      expect(res.body.message).toMatch(/Only the author of a returned or draft revision answers its findings/);
      expect((await revisionOf(t.sessions.author, t.revisionId)).findings[0].status).toBe('open');
    },
  );

  it('when the checker closes an open finding during check, then it is refused with 409: it must be answered first', async () => {
    // Arrange
    const t = await team();
    await advanceTo('in_check', t.sessions, t.revisionId);
    const raised = await t.checker.session.post(`/api/revisions/${t.revisionId}/findings`, {
      text: 'Check the bending moment at the gear',
    });

    // Act
    const res = await t.checker.session.post(`/api/findings/${raised.body.findings[0].id}/close`);

    // Assert
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/A finding is closed once its author has answered it/);
  });

  it('when the author closes their own answered finding, then it is refused with 403', async () => {
    // Arrange
    const t = await returnedWithFinding();
    await t.author.session.post(`/api/findings/${t.findingId}/answer`, { answer: 'Done, see notes' });

    // Act
    const res = await t.author.session.post(`/api/findings/${t.findingId}/close`);

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(
      /Only an independent checker or approver reviewing this revision can close findings/,
    );
  });

  it('when a finding id does not exist, then answering and closing answer 404', async () => {
    // Arrange
    const t = await team();

    // Act
    const answer = await t.author.session.post('/api/findings/999999999/answer', { answer: 'Nothing to answer' });
    const close = await t.checker.session.post('/api/findings/999999999/close');

    // Assert
    expect([answer.status, close.status]).toEqual([404, 404]);
    expect(answer.body.message).toMatch(/Finding 999999999 was not found/);
  });

  it('when the answer is missing, then it is refused with 400 naming answer', async () => {
    // Arrange
    const t = await returnedWithFinding();

    // Act
    const res = await t.author.session.post(`/api/findings/${t.findingId}/answer`, {});

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors.answer).toEqual(['is required']);
  });
});

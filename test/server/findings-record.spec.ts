import { startTestApp, expectStatus } from '../support/api-harness';
import { advanceTo, revisionOf, sign, tickAll } from '../support/calc-harness';
import { auditOf } from '../support/audit-harness';
import { returnedWithFindingOf } from '../support/findings-harness';

// Findings once a calc moves on: approval waits for every finding to be closed, and findings with
// their answers stay on the approved record. Raising, answering and closing are findings.spec.ts.
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

const returnedWithFinding = () => returnedWithFindingOf(app);

describe('approval and the record', () => {
  it('when a finding is answered but not closed, then approval is refused until the approver closes it', async () => {
    // Arrange
    const t = await returnedWithFinding();
    await t.author.session.post(`/api/findings/${t.findingId}/answer`, { answer: 'Peterson chart 3.2' });
    await advanceTo('checked', t.sessions, t.revisionId);

    // Act
    const refused = await sign(t.approver.session, t.revisionId, 'approved');
    const closed = await t.approver.session.post(`/api/findings/${t.findingId}/close`);
    const approved = await sign(t.approver.session, t.revisionId, 'approved');

    // Assert
    expect(refused.status).toBe(403);
    expect(refused.body.message).toMatch(/Approval is refused while 1 finding\(s\) are not closed/);
    expect(closed.status).toBe(200);
    expect(approved.status).toBe(200);
    expect(approved.body.status).toBe('approved');
  });

  it('when a calc is approved, then its findings, answers and who closed them stay on the record and in the audit trail', async () => {
    // Arrange
    const t = await returnedWithFinding();
    await t.author.session.post(`/api/findings/${t.findingId}/answer`, { answer: 'Peterson chart 3.2' });
    await advanceTo('in_check', t.sessions, t.revisionId);
    expectStatus(await t.checker.session.post(`/api/findings/${t.findingId}/close`), 200, 'close');
    await tickAll(t.checker.session, t.revisionId);
    expectStatus(await sign(t.checker.session, t.revisionId, 'checked'), 200, 'check');

    // Act
    expectStatus(await sign(t.approver.session, t.revisionId, 'approved'), 200, 'approve');
    const lateAnswer = await t.author.session.post(`/api/findings/${t.findingId}/answer`, {
      answer: 'Rewriting history',
    });

    // Assert
    const r = await revisionOf(t.approver.session, t.revisionId);
    expect(r.findings).toEqual([
      expect.objectContaining({
        text: 'Name the chart behind the keyseat Kts',
        status: 'closed',
        answer: 'Peterson chart 3.2',
        raisedBy: { id: t.checker.user.id, name: t.checker.displayName },
        answeredBy: { id: t.author.user.id, name: t.author.displayName },
        closedBy: { id: t.checker.user.id, name: t.checker.displayName },
        closedAt: expect.any(String),
      }),
    ]);
    expect(lateAnswer.status).toBe(403);
    const actions = (await auditOf('Revision', t.revisionId)).map((e) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['revision.returned', 'finding.answered', 'finding.closed']));
    expect(actions.indexOf('finding.answered')).toBeLessThan(actions.indexOf('finding.closed'));
  });
});

import { startTestApp, expectStatus, person } from '../support/api-harness';
import { advanceTo, createCalc, revisionOf, sign, tickAll, type Team } from '../support/calc-harness';
import { auditOf } from '../support/audit-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

describe('every workflow event is on the trail', () => {
  it('when a calc goes from draft through a return to approval and a second revision, then each step is an audit entry by the person who did it', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const checker = await person(app, ['checker']);
    const approver = await person(app, ['approver']);
    const team: Team = { author: author.session, checker: checker.session, approver: approver.session };
    const { calcId, revisionId } = await createCalc(author.session);

    // Act
    const r0 = await revisionOf(author.session, revisionId);
    expectStatus(
      await author.session.put(`/api/revisions/${revisionId}`, {
        input: { ...r0.input, title: 'Head shaft, longer hub' },
        lockVersion: r0.lockVersion,
      }),
      200,
      'save',
    );
    await sign(author.session, revisionId, 'authored', { password: 'wrong password' });
    await advanceTo('in_check', team, revisionId);
    const returned = await checker.session.post(`/api/revisions/${revisionId}/return`, {
      reason: 'Cite the Kts chart',
      lockVersion: 1,
    });
    await author.session.post(`/api/findings/${returned.body.findings[0].id}/answer`, { answer: 'Peterson 3.2' });
    await advanceTo('in_check', team, revisionId);
    await checker.session.post(`/api/findings/${returned.body.findings[0].id}/close`);
    await tickAll(checker.session, revisionId);
    expectStatus(await sign(checker.session, revisionId, 'checked'), 200, 'check');
    expectStatus(await sign(approver.session, revisionId, 'approved'), 200, 'approve');
    const b = expectStatus(
      await author.session.post(`/api/calcs/${calcId}/revisions`, { reasonForChange: 'New coupling' }),
      201,
      'revision B',
    );
    await advanceTo('approved', team, b.body.id);

    // Assert
    expect((await auditOf('Calc', calcId)).map((e) => [e.action, e.actorId])).toEqual([
      ['calc.created', author.user.id],
    ]);
    const by = (id: number) =>
      ({ [author.user.id]: 'author', [checker.user.id]: 'checker', [approver.user.id]: 'approver' })[id];
    expect((await auditOf('Revision', revisionId)).map((e) => `${e.action} by ${by(e.actorId!)}`)).toEqual([
      'revision.saved by author',
      'revision.signature_refused by author',
      'revision.signed_authored by author',
      'revision.returned by checker',
      'finding.answered by author',
      'revision.signed_authored by author',
      'finding.closed by checker',
      'revision.manual_item by checker',
      'revision.manual_item by checker',
      'revision.manual_item by checker',
      'revision.signed_checked by checker',
      'revision.signed_approved by approver',
      'revision.superseded by approver',
    ]);
    expect((await auditOf('Revision', b.body.id)).map((e) => e.action)).toEqual([
      'revision.created',
      'revision.signed_authored',
      'revision.manual_item',
      'revision.manual_item',
      'revision.manual_item',
      'revision.signed_checked',
      'revision.signed_approved',
    ]);
    expect((await auditOf('Revision', revisionId))[0].diff).toMatch(/^\+\s+"title": "Head shaft, longer hub",?$/m);
  });
});

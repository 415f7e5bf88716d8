import { startTestApp, expectStatus, person, type Person } from '../support/api-harness';
import { advanceTo, createCalc, revisionOf, sign, tickAll } from '../support/calc-harness';
import { auditOf, lastAuditId } from '../support/audit-harness';
import type { Role } from '../../shared/authz/roles';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

/**
 * Revision A written and approved with `firstAuthor`, then revision B written by someone else and
 * submitted: the situation in which an earlier editor might slip into reviewing the calc.
 */
async function secondRevisionBy(firstAuthorRoles: Role[]) {
  const firstAuthor = await person(app, firstAuthorRoles, 'first');
  const checker = await person(app, ['checker']);
  const approver = await person(app, ['approver']);
  const secondAuthor = await person(app, ['author'], 'second');
  const { calcId, revisionId: revA } = await createCalc(firstAuthor.session);
  await advanceTo(
    'approved',
    { author: firstAuthor.session, checker: checker.session, approver: approver.session },
    revA,
  );
  const b = expectStatus(
    await secondAuthor.session.post(`/api/calcs/${calcId}/revisions`, { reasonForChange: 'Longer coupling seat' }),
    201,
    'new revision',
  );
  return { firstAuthor, checker, approver, secondAuthor, calcId, revA, revB: b.body.id as number };
}

describe('independence across revisions', () => {
  it('when the author+checker who edited revision A signs revision B as checked, then it is refused though someone else wrote B', async () => {
    // Arrange
    const { firstAuthor, secondAuthor, revB } = await secondRevisionBy(['author', 'checker']);
    await advanceTo(
      'in_check',
      { author: secondAuthor.session, checker: secondAuthor.session, approver: secondAuthor.session },
      revB,
    );

    // Act
    const res = await sign(firstAuthor.session, revB, 'checked');

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(
      /You edited this calc, so you cannot sign it as checked; independence requires someone else/,
    );
    const b = await revisionOf(secondAuthor.session, revB);
    expect(b.status).toBe('in_check');
    expect(b.editorIds).toEqual(expect.arrayContaining([firstAuthor.user.id, secondAuthor.user.id]));
  });

  it.each([
    [
      'raise a finding on',
      (p: Person, id: number) => p.session.post(`/api/revisions/${id}/findings`, { text: 'Fillet radius looks small' }),
    ],
    [
      'tick a manual item of',
      (p: Person, id: number) => p.session.put(`/api/revisions/${id}/manual-items/load-cases`, { done: true }),
    ],
    [
      'return',
      async (p: Person, id: number) =>
        p.session.post(`/api/revisions/${id}/return`, {
          reason: 'Please recheck the torque',
          lockVersion: (await revisionOf(p.session, id)).lockVersion,
        }),
    ],
  ])(
    'when the author+checker who edited revision A tries to %s revision B, then it is refused and nothing is recorded',
    async (_what, act) => {
      // Arrange
      const { firstAuthor, secondAuthor, revB } = await secondRevisionBy(['author', 'checker']);
      await advanceTo(
        'in_check',
        { author: secondAuthor.session, checker: secondAuthor.session, approver: secondAuthor.session },
        revB,
      );
      const since = await lastAuditId();

      // Act
      const res = await act(firstAuthor, revB);

      // Assert
      expect(res.status).toBe(403);
      expect(res.body.message).toMatch(/You edited this calc, so you cannot review it/);
      const b = await revisionOf(secondAuthor.session, revB);
      expect([b.status, b.findings, b.manualItems]).toEqual(['in_check', [], {}]);
      expect(await auditOf('Revision', revB, since)).toEqual([]);
    },
  );

  it('when the author+approver who edited revision A signs revision B as approved, then it is refused', async () => {
    // Arrange
    const { firstAuthor, secondAuthor, checker, revB } = await secondRevisionBy(['author', 'approver']);
    await advanceTo(
      'checked',
      { author: secondAuthor.session, checker: checker.session, approver: checker.session },
      revB,
    );

    // Act
    const res = await sign(firstAuthor.session, revB, 'approved');

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/You edited this calc, so you cannot sign it as approved/);
    expect((await revisionOf(secondAuthor.session, revB)).status).toBe('checked');
  });

  // Reviewing is not editing: the checker of A stays independent of the calc and may check B.
  it('when the checker of revision A checks revision B, then it is accepted', async () => {
    // Arrange
    const { checker, secondAuthor, revB } = await secondRevisionBy(['author']);
    await advanceTo(
      'in_check',
      { author: secondAuthor.session, checker: checker.session, approver: checker.session },
      revB,
    );
    await tickAll(checker.session, revB);

    // Act
    const res = await sign(checker.session, revB, 'checked');

    // Assert
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('checked');
  });
});

describe('independence within one revision', () => {
  it('when a checker+approver who checked a revision signs it as approved, then it is refused', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const both = await person(app, ['checker', 'approver'], 'chkapp');
    const { revisionId } = await createCalc(author.session);
    await advanceTo('checked', { author: author.session, checker: both.session, approver: both.session }, revisionId);

    // Act
    const res = await sign(both.session, revisionId, 'approved');

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/You checked this revision, so you cannot also approve it/);
  });

  it('when an author+approver approves their own checked revision, then it is refused', async () => {
    // Arrange
    const author = await person(app, ['author', 'approver'], 'authapp');
    const checker = await person(app, ['checker']);
    const { revisionId } = await createCalc(author.session);
    await advanceTo(
      'checked',
      { author: author.session, checker: checker.session, approver: checker.session },
      revisionId,
    );

    // Act
    const res = await sign(author.session, revisionId, 'approved');

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/You edited this calc/);
  });
});

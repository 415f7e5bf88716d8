import { randomUUID } from 'node:crypto';
import { startTestApp, TEST_PASSWORD, person, type Session } from '../support/api-harness';
import { advanceTo, createCalc, revisionOf, sign, tickAll, type Team } from '../support/calc-harness';

// What a sign-off step records when it is allowed, and how a step in the wrong state or a
// signature on someone else's behalf is refused. The role-by-role matrix is workflow-transitions.spec.ts.
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type From = 'draft' | 'in_check' | 'checked';
const RETURN_REFUSAL = /Only an independent checker \(in check\) or approver \(checked\) can return/;
const lockVersionOf = async (s: Session, id: number) => (await revisionOf(s, id)).lockVersion as number;

async function arrange(from: From, team: Team, revisionId: number): Promise<void> {
  if (from !== 'draft') await advanceTo(from, team, revisionId);
  if (from === 'in_check') await tickAll(team.checker, revisionId);
}

describe('what an allowed transition records', () => {
  it("when each of the three signs, then each signature carries that person's printed name, role and meaning, and each step its own time", async () => {
    // Arrange
    const author = await person(app, ['author']);
    const checker = await person(app, ['checker']);
    const approver = await person(app, ['approver']);
    const { revisionId } = await createCalc(author.session);

    // Act
    await advanceTo(
      'approved',
      { author: author.session, checker: checker.session, approver: approver.session },
      revisionId,
    );

    // Assert
    const r = await revisionOf(author.session, revisionId);
    expect(
      r.signatures.map((s: { printedName: string; role: string; meaning: string }) => [
        s.printedName,
        s.role,
        s.meaning,
      ]),
    ).toEqual([
      [author.displayName, 'author', 'authored'],
      [checker.displayName, 'checker', 'checked'],
      [approver.displayName, 'approver', 'approved'],
    ]);
    expect([r.author.id, r.checker.id, r.approver.id]).toEqual([author.user.id, checker.user.id, approver.user.id]);
    // Each step keeps its own time: signing later never overwrites when the calc was submitted.
    expect([r.submittedAt, r.checkedAt, r.approvedAt]).toEqual(
      r.signatures.map((s: { signedAt: string }) => s.signedAt),
    );
  });

  it.each([
    ['checker', 'in_check'],
    ['approver', 'checked'],
  ] as const)(
    'when the %s returns a revision, then the reason becomes an open finding they raised',
    async (role, from) => {
      // Arrange
      const author = await person(app, ['author']);
      const team: Team = {
        author: author.session,
        checker: (await person(app, ['checker'])).session,
        approver: (await person(app, ['approver'])).session,
      };
      const returner = await person(app, [role]);
      const { revisionId } = await createCalc(author.session);
      await arrange(from, team, revisionId);

      // Act
      const res = await returner.session.post(`/api/revisions/${revisionId}/return`, {
        reason: 'Cite the chart behind Kts at the gear keyseat',
        lockVersion: await lockVersionOf(author.session, revisionId),
      });

      // Assert
      expect(res.status).toBe(200);
      expect(res.body.status).toBe('returned');
      expect(res.body.findings).toEqual([
        expect.objectContaining({
          text: 'Cite the chart behind Kts at the gear keyseat',
          status: 'open',
          raisedBy: { id: returner.user.id, name: returner.displayName },
        }),
      ]);
    },
  );

  it('when the author withdraws a returned revision, then it is withdrawn', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const checker = await person(app, ['checker']);
    const { revisionId } = await createCalc(author.session);
    await advanceTo(
      'in_check',
      { author: author.session, checker: checker.session, approver: checker.session },
      revisionId,
    );
    await checker.session.post(`/api/revisions/${revisionId}/return`, {
      reason: 'Wrong load case',
      lockVersion: await lockVersionOf(author.session, revisionId),
    });

    // Act
    const res = await author.session.post(`/api/revisions/${revisionId}/withdraw`, {
      reason: 'Replaced by a new calc',
      lockVersion: await lockVersionOf(author.session, revisionId),
    });

    // Assert
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('withdrawn');
  });
});

describe('wrong state', () => {
  const CASES: {
    name: string;
    from: From | 'approved';
    who: 'author' | 'checker' | 'approver';
    act: (s: Session, id: number) => Promise<{ status: number; body: { message?: string } }>;
    message: RegExp;
  }[] = [
    {
      name: 'the author submits a revision already in check',
      from: 'in_check',
      who: 'author',
      act: (s, id) => sign(s, id, 'authored'),
      message: /in check revision cannot be signed as authored/,
    },
    {
      name: 'a checker signs a draft as checked',
      from: 'draft',
      who: 'checker',
      act: (s, id) => sign(s, id, 'checked'),
      message: /draft revision cannot be signed as checked/,
    },
    {
      name: 'an approver approves a revision still in check',
      from: 'in_check',
      who: 'approver',
      act: (s, id) => sign(s, id, 'approved'),
      message: /in check revision cannot be signed as approved/,
    },
    {
      name: 'an approver approves an approved revision again',
      from: 'approved',
      who: 'approver',
      act: (s, id) => sign(s, id, 'approved'),
      message: /approved revision cannot be signed as approved/,
    },
    {
      name: 'a checker returns a draft',
      from: 'draft',
      who: 'checker',
      act: async (s, id) => s.post(`/api/revisions/${id}/return`, { reason: 'Not ready yet', lockVersion: 0 }),
      message: RETURN_REFUSAL,
    },
    {
      name: 'the author withdraws a revision in check',
      from: 'in_check',
      who: 'author',
      act: async (s, id) => s.post(`/api/revisions/${id}/withdraw`, { reason: 'Changed my mind', lockVersion: 0 }),
      message: /Only the author can withdraw a draft or returned revision/,
    },
  ];

  it.each(CASES)(
    'when $name, then it is refused with 403 and a message naming the state',
    async ({ from, who, act, message }) => {
      // Arrange
      const author = await person(app, ['author']);
      const team: Team = {
        author: author.session,
        checker: (await person(app, ['checker'])).session,
        approver: (await person(app, ['approver'])).session,
      };
      const { revisionId } = await createCalc(author.session);
      if (from !== 'draft') await advanceTo(from, team, revisionId);

      // Act
      const res = await act(team[who], revisionId);

      // Assert
      expect(res.status).toBe(403);
      expect(res.body.message).toMatch(message);
      expect((await revisionOf(author.session, revisionId)).status).toBe(from);
    },
  );

  it('when a signature is sent with an old lockVersion, then it is refused with 409 and nothing is signed', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session);
    const stale = await lockVersionOf(author.session, revisionId);
    await author.session.put(`/api/revisions/${revisionId}`, {
      input: (await revisionOf(author.session, revisionId)).input,
      lockVersion: stale,
    });

    // Act
    const res = await author.session.post(`/api/revisions/${revisionId}/sign`, {
      password: TEST_PASSWORD,
      meaning: 'authored',
      idempotencyKey: randomUUID(),
      lockVersion: stale,
    });

    // Assert
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/changed since you opened it/);
    expect((await revisionOf(author.session, revisionId)).signatures).toEqual([]);
  });
});

describe('nobody signs for someone else', () => {
  it.each(['printedName', 'userId', 'role'])(
    'when a sign request names a %s, then it is refused with 400 naming that field',
    async (field) => {
      // Arrange
      const author = await person(app, ['author']);
      const { revisionId } = await createCalc(author.session);

      // Act
      const res = await author.session.post(`/api/revisions/${revisionId}/sign`, {
        password: TEST_PASSWORD,
        meaning: 'authored',
        idempotencyKey: randomUUID(),
        lockVersion: 0,
        [field]: field === 'userId' ? 1 : 'Someone Else',
      });

      // Assert
      expect(res.status).toBe(400);
      expect(res.body.fieldErrors[field]).toEqual(['is not an accepted field']);
      expect((await revisionOf(author.session, revisionId)).signatures).toEqual([]);
    },
  );
});

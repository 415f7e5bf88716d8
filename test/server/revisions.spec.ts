import { startTestApp, expectStatus, person } from '../support/api-harness';
import { advanceTo, createCalc, fixtureInput, revisionOf, type Team } from '../support/calc-harness';
import { auditOf, lastAuditId } from '../support/audit-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

async function approvedCalc(scheme: 'letters' | 'numbers' = 'letters') {
  const author = await person(app, ['author']);
  const checker = await person(app, ['checker']);
  const approver = await person(app, ['approver']);
  const sessions: Team = { author: author.session, checker: checker.session, approver: approver.session };
  const created = await createCalc(author.session, { scheme });
  await advanceTo('approved', sessions, created.revisionId);
  return { author, checker, approver, sessions, ...created };
}

const newRevision = (s: Team['author'], calcId: number, reasonForChange = 'Coupling seat lengthened to 50 mm') =>
  s.post(`/api/calcs/${calcId}/revisions`, { reasonForChange });

describe('approval supersedes', () => {
  it('when revision B is approved, then revision A becomes superseded and the change is audited', async () => {
    // Arrange
    const t = await approvedCalc();
    const b = expectStatus(await newRevision(t.author.session, t.calcId), 201, 'new revision');
    const since = await lastAuditId();

    // Act
    await advanceTo('approved', t.sessions, b.body.id);

    // Assert
    const calc = (await t.author.session.get(`/api/calcs/${t.calcId}`)).body;
    expect(calc.revisions.map((r: { label: string; status: string }) => [r.label, r.status])).toEqual([
      ['A', 'superseded'],
      ['B', 'approved'],
    ]);
    expect(await auditOf('Revision', t.revisionId, since)).toEqual([
      expect.objectContaining({
        action: 'revision.superseded',
        actorId: t.approver.user.id,
        payload: { calcId: t.calcId, revision: 'A', supersededBy: 'B' },
      }),
    ]);
  });
});

describe('read-only records', () => {
  it.each(['approved', 'superseded'] as const)(
    'when the author saves a revision that is %s, then it is 409 saying to start a new revision, and nothing changes',
    async (state) => {
      // Arrange
      const t = await approvedCalc();
      if (state === 'superseded')
        await advanceTo('approved', t.sessions, (await newRevision(t.author.session, t.calcId)).body.id);
      const before = await revisionOf(t.author.session, t.revisionId);
      const input = { ...before.input, title: 'Quietly changed' };

      // Act
      const res = await t.author.session.put(`/api/revisions/${t.revisionId}`, {
        input,
        lockVersion: before.lockVersion,
      });

      // Assert
      expect(res.status).toBe(409);
      expect(res.body.message).toBe(`Revision A is ${state} and cannot be edited; start a new revision to change it`);
      const after = await revisionOf(t.author.session, t.revisionId);
      expect([after.input, after.lockVersion, after.contentHash]).toEqual([
        before.input,
        before.lockVersion,
        before.contentHash,
      ]);
    },
  );

  it('when the author withdraws an approved revision, then it is refused with 403', async () => {
    // Arrange
    const t = await approvedCalc();

    // Act
    const res = await t.author.session.post(`/api/revisions/${t.revisionId}/withdraw`, {
      reason: 'No longer needed',
      lockVersion: 0,
    });

    // Assert
    expect(res.status).toBe(403);
    expect((await revisionOf(t.author.session, t.revisionId)).status).toBe('approved');
  });
});

describe('a new revision', () => {
  it('when an author starts one after approval, then it is a draft copy with the next letter, their name and the reason', async () => {
    // Arrange
    const t = await approvedCalc();
    const second = await person(app, ['author'], 'second');
    const a = await revisionOf(t.author.session, t.revisionId);

    // Act
    const res = await newRevision(second.session, t.calcId, 'Coupling seat lengthened to 50 mm');

    // Assert
    expect(res.status).toBe(201);
    expect(res.body).toEqual(
      expect.objectContaining({
        label: 'B',
        seq: 1,
        status: 'draft',
        reasonForChange: 'Coupling seat lengthened to 50 mm',
        input: a.input,
        author: { id: second.user.id, name: second.displayName },
        checker: null,
        approver: null,
        signatures: [],
        findings: [],
        manualItems: {},
        lockVersion: 0,
      }),
    );
    expect(res.body.editorIds).toEqual(expect.arrayContaining([t.author.user.id, second.user.id]));
    expect(
      (await auditOf('Revision', res.body.id)).map((e) => [e.action, e.payload.from, e.payload.reasonForChange]),
    ).toEqual([['revision.created', 'A', 'Coupling seat lengthened to 50 mm']]);
  });

  it('when the project numbers its revisions, then the revision after 0 is 1', async () => {
    // Arrange
    const t = await approvedCalc('numbers');

    // Act
    const res = await newRevision(t.author.session, t.calcId);

    // Assert
    expect(res.status).toBe(201);
    expect([(await revisionOf(t.author.session, t.revisionId)).label, res.body.label]).toEqual(['0', '1']);
  });

  it.each([
    ['no reason', {}, ['is required']],
    ['a reason of two letters', { reasonForChange: 'ok' }, ['must say why, in at least 5 characters']],
  ])('when it is asked for with %s, then it is 400 naming reasonForChange', async (_what, body, messages) => {
    // Arrange
    const t = await approvedCalc();

    // Act
    const res = await t.author.session.post(`/api/calcs/${t.calcId}/revisions`, body);

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({ reasonForChange: messages });
    expect((await t.author.session.get(`/api/calcs/${t.calcId}`)).body.revisions).toHaveLength(1);
  });

  it.each(['draft', 'in_check', 'checked'] as const)(
    'when the latest revision is still %s, then another is refused with 409 naming its state',
    async (state) => {
      // Arrange
      const author = await person(app, ['author']);
      const sessions: Team = {
        author: author.session,
        checker: (await person(app, ['checker'])).session,
        approver: (await person(app, ['approver'])).session,
      };
      const { calcId, revisionId } = await createCalc(author.session);
      if (state !== 'draft') await advanceTo(state, sessions, revisionId);

      // Act
      const res = await newRevision(author.session, calcId);

      // Assert
      expect(res.status).toBe(409);
      expect(res.body.message).toBe(
        `Revision A is still ${state.replace('_', ' ')}; finish or withdraw it before starting another`,
      );
    },
  );

  it('when the latest revision was withdrawn, then a new one may start', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const { calcId, revisionId } = await createCalc(author.session);
    await author.session.post(`/api/revisions/${revisionId}/withdraw`, { reason: 'Wrong shaft', lockVersion: 0 });

    // Act
    const res = await newRevision(author.session, calcId);

    // Assert
    expect(res.status).toBe(201);
    expect([res.body.label, res.body.status]).toEqual(['B', 'draft']);
  });

  it('when a checker asks for a new revision, then it is refused with 403', async () => {
    // Arrange
    const t = await approvedCalc();

    // Act
    const res = await newRevision(t.checker.session, t.calcId);

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toBe('Only authors start new revisions');
  });

  it('when revision B is changed, then the diff between A and B shows the changed input', async () => {
    // Arrange
    const t = await approvedCalc();
    const b = (await newRevision(t.author.session, t.calcId)).body;
    const input = fixtureInput();
    (input.segments as { od: number }[])[4].od = 40;
    expectStatus(
      await t.author.session.put(`/api/revisions/${b.id}`, { input, lockVersion: b.lockVersion }),
      200,
      'save B',
    );

    // Act
    const res = await t.author.session.get(`/api/calcs/${t.calcId}/diff?from=${t.revisionId}&to=${b.id}`);

    // Assert
    expect(res.status).toBe(200);
    expect(res.body.from).toEqual({ id: t.revisionId, label: 'A' });
    expect(res.body.input).toMatch(/^-\s+"od": 35,?$/m);
    expect(res.body.input).toMatch(/^\+\s+"od": 40,?$/m);
  });
});

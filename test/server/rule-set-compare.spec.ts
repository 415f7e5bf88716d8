// Comparing versions of a design standard and trying a draft on a calc without storing anything.
import { startTestApp, expectStatus, person } from '../support/api-harness';
import { advanceTo, createCalc, revisionOf, type Team } from '../support/calc-harness';
import { auditOf } from '../support/audit-harness';
import { draftStandard, saveStandard, testStandard, withParameter } from '../support/standard-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Doc = Record<string, unknown>;

describe('comparing and trying a draft', () => {
  it('when two versions are compared, then the clauses that changed are listed with their fields', async () => {
    // Arrange
    const { standard, drafter, draft } = await draftStandard(app);
    const clauses = (draft.document.clauses as Doc[]).map((c) =>
      c.id === '4.2' ? { ...c, title: 'Twist: 1° in a length of 25 diameters' } : c,
    );
    expectStatus(
      await saveStandard(
        drafter.session,
        draft.id,
        { ...draft.document, clauses, changeSummary: 'Retitled 4.2' },
        draft.lockVersion,
      ),
      200,
      'save',
    );

    // Act
    const res = await drafter.session.get(`/api/rule-sets/diff?from=${standard.id}&to=${draft.id}`);

    // Assert
    expect(res.status).toBe(200);
    const changed = res.body.changes.clauses.filter((c: { change: string }) => c.change !== 'unchanged');
    expect(changed).toEqual([
      expect.objectContaining({
        key: '4.2',
        change: 'changed',
        fields: [expect.objectContaining({ field: 'title', after: 'Twist: 1° in a length of 25 diameters' })],
      }),
    ]);
    expect(res.body.changes.counts.clauses).toEqual({ added: 0, removed: 0, changed: 1 });
  });

  it('when the diff is asked for without versions, then it is 400 naming from and to', async () => {
    // Arrange
    const reader = await person(app, ['compliance']);

    // Act
    const res = await reader.session.get('/api/rule-sets/diff?from=abc');

    // Assert
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors).sort()).toEqual(['query.from', 'query.to']);
  });

  it('when compliance tries a stricter draft on a revision, then the checklist under the draft comes back and nothing is stored', async () => {
    // Arrange
    const { standard, drafter, draft } = await draftStandard(app);
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session, { ruleSetId: standard.id });
    const stricter = {
      ...withParameter(draft.document, 'asmeSyFraction', 0.03),
      changeSummary: 'Much lower allowable shear',
    };
    expectStatus(await saveStandard(drafter.session, draft.id, stricter, draft.lockVersion), 200, 'save');
    const before = await revisionOf(author.session, revisionId);
    const trail = await auditOf('Revision', revisionId);

    // Act
    const res = await drafter.session.post(`/api/rule-sets/${draft.id}/try`, { revisionId });

    // Assert
    expect(res.status).toBe(200);
    expect(res.body.ruleSet).toEqual({ id: draft.id, code: standard.code, version: 2 });
    expect([res.body.before.verdict, res.body.checklist.verdict]).toEqual(['compliant', 'not-compliant']);
    expect(res.body.checklist.rows).toEqual(
      expect.arrayContaining([expect.objectContaining({ clauseId: '4.1', status: 'fail' })]),
    );
    const after = await revisionOf(author.session, revisionId);
    expect([after.lockVersion, after.verdict, after.checklist, after.contentHash]).toEqual([
      before.lockVersion,
      before.verdict,
      before.checklist,
      before.contentHash,
    ]);
    expect(await auditOf('Revision', revisionId)).toEqual(trail);
  });

  it('when try-it names no revision, then it is 400 naming revisionId', async () => {
    // Arrange
    const { drafter, draft } = await draftStandard(app);

    // Act
    const res = await drafter.session.post(`/api/rule-sets/${draft.id}/try`, {});

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors.revisionId).toBeDefined();
  });
});

// Keeps the set-up helpers honest: a revision checked against the test standard can be taken to approval.
describe('the test standard itself', () => {
  it('when a calc is checked against a test standard, then it can be approved like any other', async () => {
    // Arrange
    const standard = await testStandard();
    const team: Team = {
      author: (await person(app, ['author'])).session,
      checker: (await person(app, ['checker'])).session,
      approver: (await person(app, ['approver'])).session,
    };
    const { revisionId } = await createCalc(team.author, { ruleSetId: standard.id });

    // Act
    await advanceTo('approved', team, revisionId);

    // Assert
    const r = await revisionOf(team.author, revisionId);
    expect([r.status, r.verdict, r.ruleSet.code]).toEqual(['approved', 'compliant', standard.code]);
  });
});

// Reading design standards and drafting a new version of one: who may, and what is checked.
import { startTestApp, expectStatus, person } from '../support/api-harness';
import { auditOf } from '../support/audit-harness';
import { draftStandard, saveStandard, testStandard, withParameter } from '../support/standard-harness';
import type { Role } from '../../shared/authz/roles';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Doc = Record<string, unknown>;

describe.each([
  ['author', true],
  ['checker', true],
  ['approver', true],
  ['compliance', true],
  ['admin', false],
] as [Role, boolean][])('reading standards as %s', (role, canRead) => {
  it(`when someone with the ${role} role lists the standards and opens one, then it is ${canRead ? 'answered' : 'refused with 403'}`, async () => {
    // Arrange
    const standard = await testStandard();
    const reader = await person(app, [role]);

    // Act
    const list = await reader.session.get('/api/rule-sets');
    const one = await reader.session.get(`/api/rule-sets/${standard.id}`);

    // Assert
    if (canRead) {
      expect([list.status, one.status]).toEqual([200, 200]);
      expect(list.body).toEqual(
        expect.arrayContaining([
          expect.objectContaining({ id: standard.id, code: standard.code, version: 1, status: 'effective' }),
        ]),
      );
      expect(one.body.document).toEqual(
        expect.objectContaining({ code: standard.code, version: 1, clauses: expect.any(Array) }),
      );
    } else {
      expect([list.status, one.status]).toEqual([403, 403]);
    }
  });
});

describe('drafting a version', () => {
  it('when two compliance people start drafts of one standard at once, then each gets a version of its own', async () => {
    // Arrange
    const standard = await testStandard();
    const [one, two] = [await person(app, ['compliance']), await person(app, ['compliance'])];

    // Act
    const answers = await Promise.all(
      [one, two, one, two].map((p) => p.session.post('/api/rule-sets', { fromId: standard.id })),
    );

    // Assert: four drafts numbered one after another, none refused for a number another took
    expect(answers.map((r) => r.status)).toEqual([201, 201, 201, 201]);
    const versions = answers.map((r) => r.body.version as number).sort((a, b) => a - b);
    expect(versions).toEqual([2, 3, 4, 5]);
  });

  it.each(['author', 'checker', 'approver', 'admin'] as Role[])(
    'when someone with the %s role starts a draft, then it is refused with 403',
    async (role) => {
      // Arrange
      const standard = await testStandard();
      const someone = await person(app, [role]);

      // Act
      const res = await someone.session.post('/api/rule-sets', { fromId: standard.id });

      // Assert
      expect(res.status).toBe(403);
      expect(res.body.message).toBe('Only compliance drafts design standards');
    },
  );

  it('when compliance starts a draft from a version, then it is the next version, a draft without a date, and audited', async () => {
    // Act
    const { standard, drafter, draft } = await draftStandard(app);

    // Assert
    expect(draft).toEqual(
      expect.objectContaining({ code: standard.code, version: 2, status: 'draft', effectiveDate: null }),
    );
    expect(draft.document).toEqual(
      expect.objectContaining({ code: standard.code, version: 2, status: 'draft', effectiveDate: null }),
    );
    expect(await auditOf('RuleSet', draft.id)).toEqual([
      expect.objectContaining({
        action: 'rule_set.drafted',
        actorId: drafter.user.id,
        payload: { code: standard.code, version: 2, from: 1 },
      }),
    ]);
  });

  it('when compliance saves a draft, then the document is stored, its lockVersion moves on and the diff is audited', async () => {
    // Arrange
    const { drafter, draft } = await draftStandard(app);
    const document = { ...withParameter(draft.document, 'maxTwistPerDiameter', 0.04), changeSummary: 'Tighter twist' };

    // Act
    const res = await saveStandard(drafter.session, draft.id, document, draft.lockVersion);

    // Assert
    expect(res.status).toBe(200);
    expect(res.body.lockVersion).toBeGreaterThan(draft.lockVersion);
    expect(res.body.document.changeSummary).toBe('Tighter twist');
    const [saved] = (await auditOf('RuleSet', draft.id)).filter((e) => e.action === 'rule_set.saved');
    expect(saved.diff).toMatch(/^-\s+"value": 0\.05,?$/m);
    expect(saved.diff).toMatch(/^\+\s+"value": 0\.04,?$/m);
  });

  it("when the saved document claims another code, version or status, then the record's own identity is kept", async () => {
    // Arrange
    const { standard, drafter, draft } = await draftStandard(app);
    const document = {
      ...draft.document,
      code: 'HIJACKED-001',
      version: 42,
      status: 'effective',
      changeSummary: 'Identity test',
    };

    // Act
    const res = await saveStandard(drafter.session, draft.id, document, draft.lockVersion);

    // Assert
    expect(res.status).toBe(200);
    expect([res.body.code, res.body.version, res.body.status]).toEqual([standard.code, 2, 'draft']);
    expect(res.body.document).toEqual(expect.objectContaining({ code: standard.code, version: 2, status: 'draft' }));
  });

  it.each([
    [
      'a clause severity that does not exist',
      (d: Doc) => ({
        ...d,
        clauses: [{ ...(d.clauses as Doc[])[0], severity: 'sometimes' }, ...(d.clauses as Doc[]).slice(1)],
      }),
      'document.clauses[0].severity',
    ],
    ['no clauses at all', (d: Doc) => ({ ...d, clauses: [] }), 'document.clauses'],
    [
      'a parameter that is not a number',
      (d: Doc) => ({
        ...d,
        parameters: [{ ...(d.parameters as Doc[])[0], value: { much: 'wow' } }, ...(d.parameters as Doc[]).slice(1)],
      }),
      'document.parameters[0].value',
    ],
  ])(
    'when the document has %s, then it is 400 naming the path inside the document and nothing is stored',
    async (_what, spoil, path) => {
      // Arrange
      const { drafter, draft } = await draftStandard(app);

      // Act
      const res = await saveStandard(
        drafter.session,
        draft.id,
        spoil({ ...draft.document, changeSummary: 'Spoilt' }),
        draft.lockVersion,
      );

      // Assert
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.fieldErrors)).toContain(path);
      const stored = (await drafter.session.get(`/api/rule-sets/${draft.id}`)).body;
      expect([stored.lockVersion, stored.document]).toEqual([draft.lockVersion, draft.document]);
    },
  );

  it('when the document is not an object, then it is 400 naming document', async () => {
    // Arrange
    const { drafter, draft } = await draftStandard(app);

    // Act
    const res = await drafter.session.put(`/api/rule-sets/${draft.id}`, {
      document: 'clauses go here',
      lockVersion: draft.lockVersion,
    });

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors.document).toEqual(['must be a JSON object']);
  });

  it('when two compliance users save the same draft from the same lockVersion, then the second gets 409 and the first is kept', async () => {
    // Arrange
    const { drafter, draft } = await draftStandard(app);
    const colleague = await person(app, ['compliance'], 'colleague');
    const first = expectStatus(
      await saveStandard(
        drafter.session,
        draft.id,
        { ...draft.document, changeSummary: 'First edit' },
        draft.lockVersion,
      ),
      200,
      'first save',
    );

    // Act
    const res = await saveStandard(
      colleague.session,
      draft.id,
      { ...draft.document, changeSummary: 'Second edit' },
      draft.lockVersion,
    );

    // Assert
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/Someone else saved this draft since you opened it/);
    expect((await drafter.session.get(`/api/rule-sets/${draft.id}`)).body.document.changeSummary).toBe(
      first.body.document.changeSummary,
    );
  });

  it('when an author saves a draft, then it is refused with 403', async () => {
    // Arrange
    const { draft } = await draftStandard(app);
    const author = await person(app, ['author']);

    // Act
    const res = await saveStandard(
      author.session,
      draft.id,
      { ...draft.document, changeSummary: 'Not mine to change' },
      draft.lockVersion,
    );

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toBe('Only compliance edits and publishes design standards');
  });
});

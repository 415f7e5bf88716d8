import { startTestApp, TEST_PASSWORD } from '../support/api-harness';
import {
  advanceTo, auditOf, createCalc, expectStatus, person, revisionOf, testStandard, withParameter, type Session, type Team,
} from '../support/calc-harness';
import type { Role } from '../../shared/authz/roles';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());
// Each test signs several people in (Argon2) on a shared two-core machine.
jest.setTimeout(60_000);

type Doc = Record<string, unknown>;

/** A test-only standard in effect (v1) and a compliance user's fresh draft of v2 from it. */
async function drafted() {
  const standard = await testStandard();
  const drafter = await person(app, ['compliance'], 'drafter');
  const draft = expectStatus(await drafter.session.post('/api/rule-sets', { fromId: standard.id }), 201, 'draft').body;
  return { standard, drafter, draft };
}

const save = (s: Session, id: number, document: Doc, lockVersion: number) => s.put(`/api/rule-sets/${id}`, { document, lockVersion });

/** A draft saved with a change summary and proposed by its drafter: ready for a second person. */
async function proposed() {
  const d = await drafted();
  const document = { ...withParameter(d.draft.document, 'maxTwistPerDiameter', 0.04), changeSummary: 'Twist limit tightened to 0.04° per diameter' };
  const saved = expectStatus(await save(d.drafter.session, d.draft.id, document, d.draft.lockVersion), 200, 'save').body;
  const p = expectStatus(await d.drafter.session.post(`/api/rule-sets/${d.draft.id}/propose`, { effectiveDate: '2027-01-01', lockVersion: saved.lockVersion }), 200, 'propose').body;
  return { ...d, proposal: p };
}

describe.each([
  ['author', true], ['checker', true], ['approver', true], ['compliance', true], ['admin', false],
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
      expect(list.body).toEqual(expect.arrayContaining([expect.objectContaining({ id: standard.id, code: standard.code, version: 1, status: 'effective' })]));
      expect(one.body.document).toEqual(expect.objectContaining({ code: standard.code, version: 1, clauses: expect.any(Array) }));
    } else {
      expect([list.status, one.status]).toEqual([403, 403]);
    }
  });
});

describe('drafting a version', () => {
  it.each(['author', 'checker', 'approver', 'admin'] as Role[])('when someone with the %s role starts a draft, then it is refused with 403', async (role) => {
    // Arrange
    const standard = await testStandard();
    const someone = await person(app, [role]);

    // Act
    const res = await someone.session.post('/api/rule-sets', { fromId: standard.id });

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toBe('Only compliance drafts design standards');
  });

  it('when compliance starts a draft from a version, then it is the next version, a draft without a date, and audited', async () => {
    // Act
    const { standard, drafter, draft } = await drafted();

    // Assert
    expect(draft).toEqual(expect.objectContaining({ code: standard.code, version: 2, status: 'draft', effectiveDate: null }));
    expect(draft.document).toEqual(expect.objectContaining({ code: standard.code, version: 2, status: 'draft', effectiveDate: null }));
    expect(await auditOf('RuleSet', draft.id)).toEqual([expect.objectContaining({ action: 'rule_set.drafted', actorId: drafter.user.id, payload: { code: standard.code, version: 2, from: 1 } })]);
  });

  it('when compliance saves a draft, then the document is stored, its lockVersion moves on and the diff is audited', async () => {
    // Arrange
    const { drafter, draft } = await drafted();
    const document = { ...withParameter(draft.document, 'maxTwistPerDiameter', 0.04), changeSummary: 'Tighter twist' };

    // Act
    const res = await save(drafter.session, draft.id, document, draft.lockVersion);

    // Assert
    expect(res.status).toBe(200);
    expect(res.body.lockVersion).toBeGreaterThan(draft.lockVersion);
    expect(res.body.document.changeSummary).toBe('Tighter twist');
    const [saved] = (await auditOf('RuleSet', draft.id)).filter((e) => e.action === 'rule_set.saved');
    expect(saved.diff).toMatch(/^-\s+"value": 0\.05,?$/m);
    expect(saved.diff).toMatch(/^\+\s+"value": 0\.04,?$/m);
  });

  it('when the saved document claims another code, version or status, then the record\'s own identity is kept', async () => {
    // Arrange
    const { standard, drafter, draft } = await drafted();
    const document = { ...draft.document, code: 'HIJACKED-001', version: 42, status: 'effective', changeSummary: 'Identity test' };

    // Act
    const res = await save(drafter.session, draft.id, document, draft.lockVersion);

    // Assert
    expect(res.status).toBe(200);
    expect([res.body.code, res.body.version, res.body.status]).toEqual([standard.code, 2, 'draft']);
    expect(res.body.document).toEqual(expect.objectContaining({ code: standard.code, version: 2, status: 'draft' }));
  });

  it.each([
    ['a clause severity that does not exist', (d: Doc) => ({ ...d, clauses: [{ ...(d.clauses as Doc[])[0], severity: 'sometimes' }, ...(d.clauses as Doc[]).slice(1)] }), 'document.clauses[0].severity'],
    ['no clauses at all', (d: Doc) => ({ ...d, clauses: [] }), 'document.clauses'],
    ['a parameter that is not a number', (d: Doc) => ({ ...d, parameters: [{ ...(d.parameters as Doc[])[0], value: { much: 'wow' } }, ...(d.parameters as Doc[]).slice(1)] }), 'document.parameters[0].value'],
  ])('when the document has %s, then it is 400 naming the path inside the document and nothing is stored', async (_what, spoil, path) => {
    // Arrange
    const { drafter, draft } = await drafted();

    // Act
    const res = await save(drafter.session, draft.id, spoil({ ...draft.document, changeSummary: 'Spoilt' }), draft.lockVersion);

    // Assert
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors)).toContain(path);
    const stored = (await drafter.session.get(`/api/rule-sets/${draft.id}`)).body;
    expect([stored.lockVersion, stored.document]).toEqual([draft.lockVersion, draft.document]);
  });

  it('when the document is not an object, then it is 400 naming document', async () => {
    // Arrange
    const { drafter, draft } = await drafted();

    // Act
    const res = await drafter.session.put(`/api/rule-sets/${draft.id}`, { document: 'clauses go here', lockVersion: draft.lockVersion });

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors.document).toEqual(['must be a JSON object']);
  });

  it('when two compliance users save the same draft from the same lockVersion, then the second gets 409 and the first is kept', async () => {
    // Arrange
    const { drafter, draft } = await drafted();
    const colleague = await person(app, ['compliance'], 'colleague');
    const first = expectStatus(await save(drafter.session, draft.id, { ...draft.document, changeSummary: 'First edit' }, draft.lockVersion), 200, 'first save');

    // Act
    const res = await save(colleague.session, draft.id, { ...draft.document, changeSummary: 'Second edit' }, draft.lockVersion);

    // Assert
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/Someone else saved this draft since you opened it/);
    expect((await drafter.session.get(`/api/rule-sets/${draft.id}`)).body.document.changeSummary).toBe(first.body.document.changeSummary);
  });

  it('when an author saves a draft, then it is refused with 403', async () => {
    // Arrange
    const { draft } = await drafted();
    const author = await person(app, ['author']);

    // Act
    const res = await save(author.session, draft.id, { ...draft.document, changeSummary: 'Not mine to change' }, draft.lockVersion);

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toBe('Only compliance edits and publishes design standards');
  });
});

describe('proposing and confirming', () => {
  it.each([
    ['no effective date', {}, 'effectiveDate'],
    ['a date that is not a date', { effectiveDate: '2027-13-45' }, 'effectiveDate'],
    ['no lockVersion', { effectiveDate: '2027-01-01' }, 'lockVersion'],
  ])('when a draft is proposed with %s, then it is 400 naming the field', async (_what, body, field) => {
    // Arrange
    const { drafter, draft } = await drafted();

    // Act
    const res = await drafter.session.post(`/api/rule-sets/${draft.id}/propose`, { lockVersion: draft.lockVersion, ...body, ...(field === 'lockVersion' ? { lockVersion: undefined } : {}) });

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors[field]).toBeDefined();
  });

  it('when the proposer confirms their own proposal, then it is refused with 403 and the draft stays a draft', async () => {
    // Arrange
    const { drafter, draft, proposal } = await proposed();

    // Act
    const res = await drafter.session.post(`/api/rule-sets/${draft.id}/confirm`, { password: TEST_PASSWORD, lockVersion: proposal.lockVersion });

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toBe('A second compliance user must confirm; you proposed this version');
    expect((await drafter.session.get(`/api/rule-sets/${draft.id}`)).body.status).toBe('draft');
  });

  it('when a second compliance user confirms with a wrong password, then it is 400 naming password and nothing changes', async () => {
    // Arrange
    const { draft, proposal } = await proposed();
    const confirmer = await person(app, ['compliance'], 'confirmer');

    // Act
    const res = await confirmer.session.post(`/api/rule-sets/${draft.id}/confirm`, { password: 'not my password', lockVersion: proposal.lockVersion });

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({ password: ['is not correct'] });
    expect((await confirmer.session.get(`/api/rule-sets/${draft.id}`)).body.status).toBe('draft');
  });

  it('when a draft that was never proposed is confirmed, then it is 409', async () => {
    // Arrange
    const { draft } = await drafted();
    const confirmer = await person(app, ['compliance'], 'confirmer');

    // Act
    const res = await confirmer.session.post(`/api/rule-sets/${draft.id}/confirm`, { password: TEST_PASSWORD, lockVersion: draft.lockVersion });

    // Assert
    expect(res.status).toBe(409);
    expect(res.body.message).toBe('Propose the version with an effective date first');
  });

  it('when the draft changed after it was proposed, then confirming the old lockVersion is 409', async () => {
    // Arrange
    const { drafter, draft, proposal } = await proposed();
    const confirmer = await person(app, ['compliance'], 'confirmer');
    expectStatus(await save(drafter.session, draft.id, { ...proposal.document, changeSummary: 'Changed after proposing' }, proposal.lockVersion), 200, 'late save');

    // Act
    const res = await confirmer.session.post(`/api/rule-sets/${draft.id}/confirm`, { password: TEST_PASSWORD, lockVersion: proposal.lockVersion });

    // Assert
    expect(res.status).toBe(409);
    expect((await drafter.session.get(`/api/rule-sets/${draft.id}`)).body.status).toBe('draft');
  });

  it('when a second compliance user confirms with their password, then the version is effective, the previous one retired, and both are audited', async () => {
    // Arrange
    const { standard, drafter, draft, proposal } = await proposed();
    const confirmer = await person(app, ['compliance'], 'confirmer');

    // Act
    const res = await confirmer.session.post(`/api/rule-sets/${draft.id}/confirm`, { password: TEST_PASSWORD, lockVersion: proposal.lockVersion });

    // Assert
    expect(res.status).toBe(200);
    expect(res.body).toEqual(expect.objectContaining({
      status: 'effective', effectiveDate: '2027-01-01', proposedBy: drafter.displayName, confirmedBy: confirmer.displayName,
    }));
    expect(res.body.document).toEqual(expect.objectContaining({ status: 'effective', effectiveDate: '2027-01-01' }));
    expect((await confirmer.session.get(`/api/rule-sets/${standard.id}`)).body.status).toBe('retired');
    expect((await auditOf('RuleSet', draft.id)).map((e) => [e.action, e.actorId])).toEqual([
      ['rule_set.drafted', drafter.user.id], ['rule_set.saved', drafter.user.id], ['rule_set.proposed', drafter.user.id], ['rule_set.effective', confirmer.user.id],
    ]);
    expect((await auditOf('RuleSet', draft.id)).at(-1)!.payload).toEqual(expect.objectContaining({ retired: [1] }));
  });

  it('when an author tries to propose or confirm, then both are refused with 403', async () => {
    // Arrange
    const { draft, proposal } = await proposed();
    const author = await person(app, ['author']);

    // Act
    const propose = await author.session.post(`/api/rule-sets/${draft.id}/propose`, { effectiveDate: '2027-01-01', lockVersion: proposal.lockVersion });
    const confirm = await author.session.post(`/api/rule-sets/${draft.id}/confirm`, { password: TEST_PASSWORD, lockVersion: proposal.lockVersion });

    // Assert
    expect([propose.status, confirm.status]).toEqual([403, 403]);
  });
});

describe('frozen versions', () => {
  it('when anyone saves an effective or a retired version, then it is 409 and the version is unchanged', async () => {
    // Arrange
    const { standard, draft, proposal } = await proposed();
    const confirmer = await person(app, ['compliance'], 'confirmer');
    const effective = expectStatus(await confirmer.session.post(`/api/rule-sets/${draft.id}/confirm`, { password: TEST_PASSWORD, lockVersion: proposal.lockVersion }), 200, 'confirm').body;
    const retired = (await confirmer.session.get(`/api/rule-sets/${standard.id}`)).body;

    // Act
    const onEffective = await save(confirmer.session, effective.id, { ...effective.document, changeSummary: 'Sneaky edit' }, effective.lockVersion);
    const onRetired = await save(confirmer.session, retired.id, { ...retired.document, changeSummary: 'Sneaky edit' }, retired.lockVersion);

    // Assert
    expect([onEffective.status, onRetired.status]).toEqual([409, 409]);
    expect(onEffective.body.message).toBe(`${standard.code} v2 is effective; it never changes again`);
    expect(onRetired.body.message).toBe(`${standard.code} v1 is retired; it never changes again`);
    expect((await confirmer.session.get(`/api/rule-sets/${effective.id}`)).body.contentHash).toBe(effective.contentHash);
  });
});

describe('comparing and trying a draft', () => {
  it('when two versions are compared, then the clauses that changed are listed with their fields', async () => {
    // Arrange
    const { standard, drafter, draft } = await drafted();
    const clauses = (draft.document.clauses as Doc[]).map((c) => (c.id === '4.2' ? { ...c, title: 'Twist: 1° in a length of 25 diameters' } : c));
    expectStatus(await save(drafter.session, draft.id, { ...draft.document, clauses, changeSummary: 'Retitled 4.2' }, draft.lockVersion), 200, 'save');

    // Act
    const res = await drafter.session.get(`/api/rule-sets/diff?from=${standard.id}&to=${draft.id}`);

    // Assert
    expect(res.status).toBe(200);
    const changed = res.body.changes.clauses.filter((c: { change: string }) => c.change !== 'unchanged');
    expect(changed).toEqual([expect.objectContaining({ key: '4.2', change: 'changed', fields: [expect.objectContaining({ field: 'title', after: 'Twist: 1° in a length of 25 diameters' })] })]);
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
    const { standard, drafter, draft } = await drafted();
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session, { ruleSetId: standard.id });
    const stricter = { ...withParameter(draft.document, 'asmeSyFraction', 0.03), changeSummary: 'Much lower allowable shear' };
    expectStatus(await save(drafter.session, draft.id, stricter, draft.lockVersion), 200, 'save');
    const before = await revisionOf(author.session, revisionId);
    const trail = await auditOf('Revision', revisionId);

    // Act
    const res = await drafter.session.post(`/api/rule-sets/${draft.id}/try`, { revisionId });

    // Assert
    expect(res.status).toBe(200);
    expect(res.body.ruleSet).toEqual({ id: draft.id, code: standard.code, version: 2 });
    expect([res.body.before.verdict, res.body.checklist.verdict]).toEqual(['compliant', 'not-compliant']);
    expect(res.body.checklist.rows).toEqual(expect.arrayContaining([expect.objectContaining({ clauseId: '4.1', status: 'fail' })]));
    const after = await revisionOf(author.session, revisionId);
    expect([after.lockVersion, after.verdict, after.checklist, after.contentHash]).toEqual([before.lockVersion, before.verdict, before.checklist, before.contentHash]);
    expect(await auditOf('Revision', revisionId)).toEqual(trail);
  });

  it('when try-it names no revision, then it is 400 naming revisionId', async () => {
    // Arrange
    const { drafter, draft } = await drafted();

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
    const team: Team = { author: (await person(app, ['author'])).session, checker: (await person(app, ['checker'])).session, approver: (await person(app, ['approver'])).session };
    const { revisionId } = await createCalc(team.author, { ruleSetId: standard.id });

    // Act
    await advanceTo('approved', team, revisionId);

    // Assert
    const r = await revisionOf(team.author, revisionId);
    expect([r.status, r.verdict, r.ruleSet.code]).toEqual(['approved', 'compliant', standard.code]);
  });
});

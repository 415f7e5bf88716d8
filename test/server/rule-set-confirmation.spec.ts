// The two-person rule for a new version of a design standard, and what becomes frozen.
import { startTestApp, TEST_PASSWORD, expectStatus, person } from '../support/api-harness';
import { auditOf } from '../support/audit-harness';
import { draftStandard, proposeStandard, saveStandard } from '../support/standard-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

describe('proposing and confirming', () => {
  it.each([
    ['no effective date', {}, 'effectiveDate'],
    ['a date that is not a date', { effectiveDate: '2027-13-45' }, 'effectiveDate'],
    ['no lockVersion', { effectiveDate: '2026-11-01' }, 'lockVersion'],
  ])('when a draft is proposed with %s, then it is 400 naming the field', async (_what, body, field) => {
    // Arrange
    const { drafter, draft } = await draftStandard(app);

    // Act
    const res = await drafter.session.post(`/api/rule-sets/${draft.id}/propose`, {
      lockVersion: draft.lockVersion,
      ...body,
      ...(field === 'lockVersion' ? { lockVersion: undefined } : {}),
    });

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors[field]).toBeDefined();
  });

  it('when the proposer confirms their own proposal, then it is refused with 403 and the draft stays a draft', async () => {
    // Arrange
    const { drafter, draft, proposal } = await proposeStandard(app);

    // Act
    const res = await drafter.session.post(`/api/rule-sets/${draft.id}/confirm`, {
      password: TEST_PASSWORD,
      lockVersion: proposal.lockVersion,
    });

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toBe('A second compliance user must confirm; you proposed this version');
    expect((await drafter.session.get(`/api/rule-sets/${draft.id}`)).body.status).toBe('draft');
  });

  it('when a second compliance user confirms with a wrong password, then it is 400 naming password and nothing changes', async () => {
    // Arrange
    const { draft, proposal } = await proposeStandard(app);
    const confirmer = await person(app, ['compliance'], 'confirmer');

    // Act
    const res = await confirmer.session.post(`/api/rule-sets/${draft.id}/confirm`, {
      password: 'not my password',
      lockVersion: proposal.lockVersion,
    });

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({ password: ['is not correct'] });
    expect((await confirmer.session.get(`/api/rule-sets/${draft.id}`)).body.status).toBe('draft');
  });

  it('when a draft that was never proposed is confirmed, then it is 409', async () => {
    // Arrange
    const { draft } = await draftStandard(app);
    const confirmer = await person(app, ['compliance'], 'confirmer');

    // Act
    const res = await confirmer.session.post(`/api/rule-sets/${draft.id}/confirm`, {
      password: TEST_PASSWORD,
      lockVersion: draft.lockVersion,
    });

    // Assert
    expect(res.status).toBe(409);
    expect(res.body.message).toBe('Propose the version with an effective date first');
  });

  it('when the draft changed after it was proposed, then confirming the old lockVersion is 409', async () => {
    // Arrange
    const { drafter, draft, proposal } = await proposeStandard(app);
    const confirmer = await person(app, ['compliance'], 'confirmer');
    expectStatus(
      await saveStandard(
        drafter.session,
        draft.id,
        { ...proposal.document, changeSummary: 'Changed after proposing' },
        proposal.lockVersion,
      ),
      200,
      'late save',
    );

    // Act
    const res = await confirmer.session.post(`/api/rule-sets/${draft.id}/confirm`, {
      password: TEST_PASSWORD,
      lockVersion: proposal.lockVersion,
    });

    // Assert
    expect(res.status).toBe(409);
    expect((await drafter.session.get(`/api/rule-sets/${draft.id}`)).body.status).toBe('draft');
  });

  it('when a second compliance user confirms with their password, then the version is effective, the previous one retired, and both are audited', async () => {
    // Arrange
    const { standard, drafter, draft, proposal } = await proposeStandard(app);
    const confirmer = await person(app, ['compliance'], 'confirmer');

    // Act
    const res = await confirmer.session.post(`/api/rule-sets/${draft.id}/confirm`, {
      password: TEST_PASSWORD,
      lockVersion: proposal.lockVersion,
    });

    // Assert
    expect(res.status).toBe(200);
    expect(res.body).toEqual(
      expect.objectContaining({
        status: 'effective',
        effectiveDate: '2026-11-01',
        proposedBy: drafter.displayName,
        confirmedBy: confirmer.displayName,
      }),
    );
    expect(res.body.document).toEqual(expect.objectContaining({ status: 'effective', effectiveDate: '2026-11-01' }));
    expect((await confirmer.session.get(`/api/rule-sets/${standard.id}`)).body.status).toBe('retired');
    expect((await auditOf('RuleSet', draft.id)).map((e) => [e.action, e.actorId])).toEqual([
      ['rule_set.drafted', drafter.user.id],
      ['rule_set.saved', drafter.user.id],
      ['rule_set.proposed', drafter.user.id],
      ['rule_set.confirmed', confirmer.user.id],
      ['rule_set.effective', confirmer.user.id],
    ]);
    expect((await auditOf('RuleSet', draft.id)).at(-1)!.payload).toEqual(expect.objectContaining({ retired: [1] }));
  });

  it('when an author tries to propose or confirm, then both are refused with 403', async () => {
    // Arrange
    const { draft, proposal } = await proposeStandard(app);
    const author = await person(app, ['author']);

    // Act
    const propose = await author.session.post(`/api/rule-sets/${draft.id}/propose`, {
      effectiveDate: '2026-11-01',
      lockVersion: proposal.lockVersion,
    });
    const confirm = await author.session.post(`/api/rule-sets/${draft.id}/confirm`, {
      password: TEST_PASSWORD,
      lockVersion: proposal.lockVersion,
    });

    // Assert
    expect([propose.status, confirm.status]).toEqual([403, 403]);
  });
});

describe('frozen versions', () => {
  it('when anyone saves an effective or a retired version, then it is 409 and the version is unchanged', async () => {
    // Arrange
    const { standard, draft, proposal } = await proposeStandard(app);
    const confirmer = await person(app, ['compliance'], 'confirmer');
    const effective = expectStatus(
      await confirmer.session.post(`/api/rule-sets/${draft.id}/confirm`, {
        password: TEST_PASSWORD,
        lockVersion: proposal.lockVersion,
      }),
      200,
      'confirm',
    ).body;
    const retired = (await confirmer.session.get(`/api/rule-sets/${standard.id}`)).body;

    // Act
    const onEffective = await saveStandard(
      confirmer.session,
      effective.id,
      { ...effective.document, changeSummary: 'Sneaky edit' },
      effective.lockVersion,
    );
    const onRetired = await saveStandard(
      confirmer.session,
      retired.id,
      { ...retired.document, changeSummary: 'Sneaky edit' },
      retired.lockVersion,
    );

    // Assert
    expect([onEffective.status, onRetired.status]).toEqual([409, 409]);
    expect(onEffective.body.message).toBe(`${standard.code} v2 is effective; it never changes again`);
    expect(onRetired.body.message).toBe(`${standard.code} v1 is retired; it never changes again`);
    expect((await confirmer.session.get(`/api/rule-sets/${effective.id}`)).body.contentHash).toBe(
      effective.contentHash,
    );
  });
});

import { startTestApp, signedInAs, uniqueCode } from '../support/api-harness';
import { calcTeam, sign } from '../support/calc-harness';
import { draftStandard } from '../support/standard-harness';
import { recordOf } from '../../server/audit/audit-records';

// The audit trail as a compliance officer reads it: what each row is about, named as people name it,
// with a link; and the people in the trail for the person filter.
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

describe('audit trail in human words', () => {
  it('when a revision is signed, then its row names the calc number and revision label with a link, and keeps the code', async () => {
    const { author, calc, revisionId } = await calcTeam(app);
    await sign(author.session, revisionId, 'authored');
    const compliance = await signedInAs(app, ['compliance'], 'audit-words');

    const res = await compliance.session.get(`/api/audit?calcId=${calc.id}&size=50`);
    const signed = res.body.items.find((e: { action: string }) => e.action === 'revision.signed_authored');
    const created = res.body.items.find((e: { action: string }) => e.action === 'calc.created');

    expect(res.status).toBe(200);
    expect(signed).toEqual(
      expect.objectContaining({
        entityType: 'Revision',
        entityId: String(revisionId),
        record: { label: `calc ${calc.number} rev A`, link: `/calcs/${calc.id}?rev=${revisionId}` },
      }),
    );
    expect(created.record).toEqual({ label: `calc ${calc.number}`, link: `/calcs/${calc.id}` });
  });

  it('when one page names a project and an account, then each is labelled as people name it', async () => {
    const admin = await signedInAs(app, ['admin'], 'audit-words-admin');
    const code = uniqueCode('AW');
    const created = await admin.session.post('/api/projects', { code, name: 'Labelled conveyor shaft' });
    expect(created.status).toBe(201);
    const compliance = await signedInAs(app, ['compliance'], 'audit-words');

    const res = await compliance.session.get(`/api/audit?userId=${admin.user.id}&size=50`);

    const recordOf = (type: string) =>
      res.body.items.find((e: { entityType: string }) => e.entityType === type)?.record;
    expect(recordOf('Project')).toEqual({ label: `project ${code}`, link: `/projects/${created.body.id}` });
    expect(recordOf('User')).toEqual({ label: 'account of Test audit-words-admin', link: null });
  });

  it('when a standard is drafted, then its row names the standard and version with a link', async () => {
    const { drafter, draft } = await draftStandard(app);
    const compliance = await signedInAs(app, ['compliance'], 'audit-words');

    const res = await compliance.session.get(`/api/audit?userId=${drafter.user.id}&action=rule_set.&size=50`);

    expect(res.status).toBe(200);
    expect(res.body.items.find((e: { entityId: string }) => e.entityId === String(draft.id))?.record).toEqual({
      label: `standard ${draft.code} v${draft.version}`,
      link: `/rule-sets/${draft.id}`,
    });
  });

  it.each([
    ['a record no longer stored', { entityType: 'Calc', entityId: '99999999' }, 'Calc 99999999 (no longer stored)'],
    ['a number with more after it', { entityType: 'Calc', entityId: '12abc' }, 'Calc 12abc (no longer stored)'],
    ['a key of no record the product knows', { entityType: 'Settings', entityId: 'other' }, 'Settings other'],
    ['no record named', { entityType: 'User', entityId: null }, 'User'],
  ])('when a row names %s, then it says so in words and links nowhere', (_, row, label) => {
    const found = { recordId: null, recordFound: 0, recordA: null, recordB: null, recordC: null };
    expect(recordOf({ ...row, ...found })).toEqual({ label, link: null });
  });

  it('when a row names the review-health thresholds, then it says so as their screen does, with its link', () => {
    const row = { entityType: 'Settings', entityId: 'review-health', recordId: null, recordFound: 0 };
    expect(recordOf({ ...row, recordA: null, recordB: null, recordC: null })).toEqual({
      label: 'review-health thresholds',
      link: '/review-health',
    });
  });

  it('when compliance opens the person filter, then the people in the trail are listed by name', async () => {
    const { author } = await calcTeam(app);
    const compliance = await signedInAs(app, ['compliance'], 'audit-people');
    const res = await compliance.session.get('/api/audit/people');
    expect(res.status).toBe(200);
    expect(res.body).toEqual(expect.arrayContaining([{ id: author.user.id, name: expect.any(String) }]));
    expect((await author.session.get('/api/audit/people')).status).toBe(403);
  });
});

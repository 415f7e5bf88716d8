import { startTestApp, TEST_PASSWORD, person } from '../support/api-harness';
import { RuleSetRecord } from '../../server/db/models';
import { RuleSetsService } from '../../server/rule-sets/rule-sets.service';
import { testStandard } from '../support/standard-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

async function proposeAndConfirm(effectiveDate: string) {
  const standard = await testStandard();
  const drafter = await person(app, ['compliance']);
  const confirmer = await person(app, ['compliance']);
  const draft = (await drafter.session.post('/api/rule-sets', { fromId: standard.id })).body;
  const doc = { ...draft.document, changeSummary: 'Scheduling test: no technical change' };
  const saved = (
    await drafter.session.put(`/api/rule-sets/${draft.id}`, { document: doc, lockVersion: draft.lockVersion })
  ).body;
  const proposed = (
    await drafter.session.post(`/api/rule-sets/${draft.id}/propose`, { effectiveDate, lockVersion: saved.lockVersion })
  ).body;
  const confirmed = await confirmer.session.post(`/api/rule-sets/${draft.id}/confirm`, {
    password: TEST_PASSWORD,
    lockVersion: proposed.lockVersion,
  });
  return { standard, drafter, confirmed };
}

describe('design standards come into force on their effective date', () => {
  it('when a version is confirmed for a later date, then it waits, frozen, and the version in force stays in force', async () => {
    const { standard, drafter, confirmed } = await proposeAndConfirm('2999-01-01');

    expect(confirmed.status).toBe(200);
    expect(confirmed.body.status).toBe('draft');
    expect(confirmed.body.confirmedBy).not.toBeNull();
    expect((await RuleSetRecord.findByPk(standard.id))!.status).toBe('effective');
    const edit = await drafter.session.put(`/api/rule-sets/${confirmed.body.id}`, {
      document: confirmed.body.document,
      lockVersion: confirmed.body.lockVersion,
    });
    expect(edit.status).toBe(409);
  });

  it('when its date has come, then it is put in force and the older version retired', async () => {
    const { standard, confirmed } = await proposeAndConfirm('2999-01-01');
    await RuleSetRecord.update({ effectiveDate: '2020-01-01' }, { where: { id: confirmed.body.id } });

    await new RuleSetsService(sequelize).promoteDue();

    expect((await RuleSetRecord.findByPk(confirmed.body.id))!.status).toBe('effective');
    expect((await RuleSetRecord.findByPk(standard.id))!.status).toBe('retired');
  });

  it('when its date has come and the library is read, then the list shows it in force, the older version retired, and a later one still waiting', async () => {
    // Arrange
    const due = await proposeAndConfirm('2999-01-01');
    const later = await proposeAndConfirm('2999-01-01');
    await RuleSetRecord.update({ effectiveDate: '2020-01-01' }, { where: { id: due.confirmed.body.id } });

    // Act
    const res = await due.drafter.session.get('/api/rule-sets');

    // Assert
    expect(res.status).toBe(200);
    expect(due.confirmed.body.proposedBy).toMatch(/^Test compliance-/);
    const row = (id: number) => res.body.find((r: { id: number }) => r.id === id);
    expect(row(due.confirmed.body.id)).toMatchObject({
      status: 'effective',
      proposedBy: due.confirmed.body.proposedBy,
      confirmedBy: due.confirmed.body.confirmedBy,
    });
    expect(row(due.standard.id).status).toBe('retired');
    expect(row(later.confirmed.body.id)).toMatchObject({ status: 'draft', effectiveDate: '2999-01-01' });
    expect(row(later.standard.id).status).toBe('effective');
  });
});

import { startTestApp, person } from '../support/api-harness';
import { testStandard } from '../support/standard-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

describe('standards waiting for a second compliance confirmation', () => {
  it('when one compliance person proposes a version, then it waits on the overview of the others, not on their own', async () => {
    const standard = await testStandard();
    const drafter = await person(app, ['compliance']);
    const colleague = await person(app, ['compliance']);
    const author = await person(app, ['author']);
    const draft = (await drafter.session.post('/api/rule-sets', { fromId: standard.id })).body;
    const saved = (
      await drafter.session.put(`/api/rule-sets/${draft.id}`, {
        document: { ...draft.document, changeSummary: 'Overview test' },
        lockVersion: draft.lockVersion,
      })
    ).body;
    await drafter.session.post(`/api/rule-sets/${draft.id}/propose`, {
      effectiveDate: '2026-11-01',
      lockVersion: saved.lockVersion,
    });

    const links = async (s: typeof drafter) =>
      ((await s.session.get('/api/dashboard')).body.waiting as { link: string }[]).map((w) => w.link);

    expect(await links(colleague)).toContain(`/rule-sets/${draft.id}`);
    expect(await links(drafter)).not.toContain(`/rule-sets/${draft.id}`);
    expect(await links(author)).toEqual([]);
  });
});

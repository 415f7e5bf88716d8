import { QueryTypes } from 'sequelize';
import { createTestProject, expectStatus, startTestApp } from '../support/api-harness';
import { advanceTo, calcTeam, fixtureInput, revisionOf, sign } from '../support/calc-harness';
import { compactResult } from '../../server/calcs/stored-result';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Row = {
  id: number;
  number: string;
  latest: { status: string; verdict: string | null; label: string; author: { name: string } };
};

describe('the calc list reads summaries kept with every change', () => {
  it('when an author saves and signs, then the project list shows the latest state, verdict and author at once', async () => {
    // Arrange
    const t = await calcTeam(app);
    const before = (await t.author.session.get(`/api/calcs?projectId=${t.project.id}`)).body;

    // Act
    await sign(t.author.session, t.revisionId, 'authored');
    const after = (await t.author.session.get(`/api/calcs?projectId=${t.project.id}`)).body;

    // Assert
    expect(before.items.map((r: Row) => r.latest.status)).toEqual(['draft']);
    expect(after.items.map((r: Row) => [r.id, r.latest.status, r.latest.label])).toEqual([
      [t.calc.id, 'in_check', 'A'],
    ]);
    expect(after.items[0].latest.verdict).toBe(t.calc.latest.verdict);
    expect(after.items[0].latest.author.name).toBe(t.calc.latest.author.name);
    expect(after.total).toBe(1);
  });

  it.each([
    ['a title word', () => 'head shaft'],
    ['the drawing number', () => 'DRG-1'],
    ['the project code', (t: Team) => t.project.code],
    ['the calc number', (t: Team) => t.calc.number],
    ['the state', () => 'draft'],
  ] as [string, (t: Team) => string][])(
    'when the search box holds %s, then the calc is found',
    async (_what, termOf) => {
      const t = await calcTeam(app);
      const res = await t.author.session.get(`/api/calcs?projectId=${t.project.id}&q=${encodeURIComponent(termOf(t))}`);
      expect(res.status).toBe(200);
      expect(res.body.items.map((r: Row) => r.id)).toEqual([t.calc.id]);
    },
  );
});

type Team = Awaited<ReturnType<typeof calcTeam>>;

/** More calcs in the team's project, by number; their first revisions' ids. */
async function addCalcs(t: Team, numbers: string[]): Promise<number[]> {
  const ids = [];
  for (const number of numbers) {
    const res = await t.author.session.post('/api/calcs', {
      projectId: t.project.id,
      number,
      title: 'Another shaft',
      partRef: '',
      ruleSetId: t.calc.latest.ruleSet.id,
      input: fixtureInput(),
    });
    ids.push(expectStatus(res, 201, 'create').body.latest.id as number);
  }
  return ids;
}

/**
 * Every (project, state) whose kept count differs from the calcs themselves, read in one statement: one consistent
 * view, whatever other spec files change meanwhile.
 */
async function countsOff(): Promise<unknown[]> {
  return sequelize.query(
    `SELECT project_id, state, SUM(kept) AS kept, SUM(actual) AS actual FROM (
      SELECT project_id, state, n AS kept, 0 AS actual FROM calc_counts
      UNION ALL SELECT project_id, COALESCE(latest_status, ''), 0, 1 FROM calcs) x
    GROUP BY project_id, state HAVING SUM(kept) <> SUM(actual)`,
    { type: QueryTypes.SELECT },
  );
}

describe('list totals kept with every change', () => {
  it('when calcs are created, signed, returned, approved, revised and moved, then every total is exact', async () => {
    // Arrange: four calcs in one project, taken to different states
    const t = await calcTeam(app);
    const team = { author: t.author.session, checker: t.checker.session, approver: t.approver.session };
    const revisions = [t.revisionId, ...(await addCalcs(t, ['T-2', 'T-3', 'T-4']))];
    const total = async (filter: string) =>
      (await t.author.session.get(`/api/calcs?projectId=${t.project.id}${filter}`)).body.total;
    expect([await total(''), await total('&status=draft')]).toEqual([4, 4]);

    // Act: one in check, one returned, one approved and revised (its new revision a draft)
    await advanceTo('in_check', team, revisions[1]);
    await advanceTo('in_check', team, revisions[2]);
    const { lockVersion } = await revisionOf(t.checker.session, revisions[2]);
    const returned = await t.checker.session.post(`/api/revisions/${revisions[2]}/return`, {
      reason: 'Cite the source',
      lockVersion,
    });
    expectStatus(returned, 200, 'return');
    await advanceTo('approved', team, revisions[3]);
    const states = async () =>
      Promise.all(['draft', 'in_check', 'returned', 'approved'].map((s) => total(`&status=${s}`)));
    expect(await states()).toEqual([1, 1, 1, 1]);
    const calcId = (await revisionOf(t.author.session, revisions[3])).calcId;
    const revised = await t.author.session.post(`/api/calcs/${calcId}/revisions`, { reasonForChange: 'New key' });
    expectStatus(revised, 201, 'new revision');
    expect(await states()).toEqual([2, 1, 1, 0]);

    // A change made in SQL, not through the app: one calc moved to another project
    const other = await createTestProject();
    await sequelize.query('UPDATE calcs SET project_id = ? WHERE id = ?', { replacements: [other.id, calcId] });

    // Assert
    expect([await total(''), ...(await states())]).toEqual([3, 1, 1, 1, 0]);
    const moved = await t.author.session.get(`/api/calcs?projectId=${other.id}&status=draft`);
    expect([moved.body.total, moved.body.totalIsAtLeast]).toEqual([1, false]);
    expect(await countsOff()).toEqual([]);
  });

  it('when the whole library is listed, then its total is exact, not capped', async () => {
    const res = await (await calcTeam(app)).author.session.get('/api/calcs?size=1');
    expect(res.body.totalIsAtLeast).toBe(false);
    expect(res.body.total).toBeGreaterThanOrEqual(1);
  });
});

describe('keyset pages', () => {
  it('when a list is read page by page, then no calc repeats or goes missing and only the first page is counted', async () => {
    // Arrange: three calcs in one project
    const t = await calcTeam(app);
    await addCalcs(t, ['K-2', 'K-3']);

    // Act
    const first = (await t.author.session.get(`/api/calcs?projectId=${t.project.id}&size=2&sort=number&dir=asc`)).body;
    const second = (
      await t.author.session.get(`/api/calcs?projectId=${t.project.id}&size=2&sort=number&dir=asc&after=${first.next}`)
    ).body;

    // Assert
    expect([...first.items, ...second.items].map((r: Row) => r.number)).toEqual([t.calc.number, 'K-2', 'K-3'].sort());
    expect([first.total, second.total, second.next]).toEqual([3, null, null]);
  });

  it('when the cursor is not one the list gave, then it is a 400 naming it', async () => {
    const t = await calcTeam(app);
    const res = await t.author.session.get('/api/calcs?after=bm90LWEtY3Vyc29y');
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toHaveProperty('after');
  });
});

describe('stored results without per-field metadata', () => {
  it('when a revision is stored, then its row leaves out units and formulas, and reading puts them back under the same hash', async () => {
    // Arrange
    const t = await calcTeam(app);
    await sign(t.author.session, t.revisionId, 'authored');

    // Act
    const [row] = await sequelize.query<{ result: string }>('SELECT result FROM revisions WHERE id = ?', {
      replacements: [t.revisionId],
      type: QueryTypes.SELECT,
    });
    const read = await revisionOf(t.author.session, t.revisionId);

    // Assert
    expect(JSON.parse(row.result)).not.toHaveProperty('fields');
    expect(Object.keys(read.result.fields).length).toBeGreaterThan(10);
    expect(read.signatures.map((s: { isValid: boolean }) => s.isValid)).toEqual([true]);
  });

  it('when a row was stored with its units and formulas in place (before this change), then it still verifies', async () => {
    const t = await calcTeam(app);
    await sign(t.author.session, t.revisionId, 'authored');
    const full = (await revisionOf(t.author.session, t.revisionId)).result;
    expect(compactResult(full)).not.toContain('"fields"');

    await sequelize.query('UPDATE revisions SET result = ? WHERE id = ?', {
      replacements: [JSON.stringify(full), t.revisionId],
    });
    const read = await revisionOf(t.author.session, t.revisionId);

    expect(read.signatures.map((s: { isValid: boolean }) => s.isValid)).toEqual([true]);
    expect(read.result).toEqual(full);
  });
});

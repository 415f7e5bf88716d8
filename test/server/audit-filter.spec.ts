import { QueryTypes } from 'sequelize';
import { startTestApp } from '../support/api-harness';
import { calcTeam, effectiveRuleSetId, fixtureInput, revisionOf, sign } from '../support/calc-harness';
import { signedInAs } from '../support/api-harness';

const { app, sequelize } = startTestApp();

type AuditRow = { id: number; action: string };
type Team = Awaited<ReturnType<typeof calcTeam>>;

/** A second calc in the team's project, by its author. */
async function secondCalc(author: Team['author'], projectId: number, number: string) {
  const res = await author.session.post('/api/calcs', {
    projectId,
    number,
    title: 'Second shaft',
    partRef: 'DRG-2',
    ruleSetId: await effectiveRuleSetId(),
    input: fixtureInput(),
  });
  expect(res.status).toBe(201);
  return res;
}
afterAll(() => sequelize.close());

describe('audit trail filters', () => {
  it('when filtered by calc, then only that calc and its revisions appear', async () => {
    const { author, calc, revisionId } = await calcTeam(app);
    await calcTeam(app);
    await sign(author.session, revisionId, 'authored');
    const { session: auditor } = await signedInAs(app, ['compliance']);

    const res = await auditor.get(`/api/audit?calcId=${calc.id}&size=200`);

    expect(res.status).toBe(200);
    const records = new Set(
      res.body.items.map((e: { entityType: string; entityId: string }) => `${e.entityType}:${e.entityId}`),
    );
    expect([...records].sort()).toEqual([`Calc:${calc.id}`, `Revision:${revisionId}`].sort());
    expect(res.body.items.map((e: { action: string }) => e.action)).toEqual(
      expect.arrayContaining(['calc.created', 'revision.signed_authored']),
    );
  });

  it('when filtered by person, action and day, then every entry matches all three', async () => {
    const { author, revisionId } = await calcTeam(app);
    // The days (UTC) the signature falls in, read before and after it: a run that passes midnight spans two.
    const day = () => new Date().toISOString().slice(0, 10);
    const from = day();
    await sign(author.session, revisionId, 'authored');
    const to = day();
    const { session: auditor } = await signedInAs(app, ['compliance']);

    const res = await auditor.get(`/api/audit?userId=${author.user.id}&action=revision.signed&from=${from}&to=${to}`);

    expect(res.body.items.length).toBeGreaterThan(0);
    for (const e of res.body.items) {
      expect(e.actorId).toBe(author.user.id);
      expect(e.action.startsWith('revision.signed')).toBe(true);
      expect([from, to]).toContain(e.occurredAt.slice(0, 10));
    }
  });

  it("when filtered by project and an action group, then the total counts exactly that project's entries of it", async () => {
    // Two calcs in one project: two creations and two submissions; another project's calc stays out.
    const { author, project, revisionId } = await calcTeam(app);
    const second = await secondCalc(author, project.id, `C2-${revisionId}`);
    await sign(author.session, revisionId, 'authored');
    await sign(author.session, second.body.latest.id, 'authored');
    const other = await calcTeam(app);
    await sign(other.author.session, other.revisionId, 'authored');
    const { session: auditor } = await signedInAs(app, ['compliance']);

    const signed = await auditor.get(`/api/audit?projectId=${project.id}&action=revision.signed&size=1`);
    const created = await auditor.get(`/api/audit?projectId=${project.id}&action=calc.&size=50`);
    const none = await auditor.get(`/api/audit?projectId=${project.id}&action=rule_set.&size=50`);

    expect(signed.body).toEqual(expect.objectContaining({ total: 2, totalIsAtLeast: false }));
    expect(signed.body.items).toHaveLength(1);
    expect(created.body.total).toBe(2);
    expect(created.body.items.map((e: { action: string }) => e.action)).toEqual(['calc.created', 'calc.created']);
    expect(none.body).toEqual(expect.objectContaining({ total: 0, items: [] }));
  });

  it('when an action within a project or of one person is paged, then the pages list their entries of it, newest first', async () => {
    // Arrange: two calcs in one project, each signed, with creations between (the walk must pass over them).
    const { author, project, revisionId } = await calcTeam(app);
    await sign(author.session, revisionId, 'authored');
    const second = await secondCalc(author, project.id, `W2-${revisionId}`);
    await sign(author.session, second.body.latest.id, 'authored');
    const { session: auditor } = await signedInAs(app, ['compliance']);
    const all = (await auditor.get(`/api/audit?projectId=${project.id}&size=50`)).body.items as AuditRow[];
    const expected = all.filter((e) => e.action.startsWith('revision.signed')).map((e) => e.id);

    // Act: by keyset, one entry a page, and the second page by number
    const walked: number[] = [];
    let after: string | null = null;
    do {
      const page = await auditor.get(
        `/api/audit?projectId=${project.id}&action=revision.signed&size=1${after ? `&after=${after}` : ''}`,
      );
      walked.push(...(page.body.items as AuditRow[]).map((e) => e.id));
      after = page.body.next;
    } while (after);
    const second1 = await auditor.get(`/api/audit?projectId=${project.id}&action=revision.signed&size=1&page=1`);
    const byPerson = async (after?: string) =>
      (
        await auditor.get(
          `/api/audit?userId=${author.user.id}&action=revision.signed&size=1${after ? `&after=${after}` : ''}`,
        )
      ).body;
    const first = await byPerson();
    const personWalked = [first, await byPerson(first.next)].flatMap((page) =>
      (page.items as AuditRow[]).map((e) => e.id),
    );

    // Assert
    expect(expected).toHaveLength(2);
    expect(walked).toEqual(expected);
    expect((second1.body.items as AuditRow[]).map((e) => e.id)).toEqual([expected[1]]);
    // The same two entries as the author's own: they signed both, and nothing else in the trail is theirs to sign.
    expect(personWalked).toEqual(expected);
    expect(all.some((e) => !e.action.startsWith('revision.signed'))).toBe(true);
  });

  it('when an action group alone is paged, then its pages merge every matching action newest first', async () => {
    // Arrange: entries of several revision actions (created, signed), then a window closed at the newest of them,
    // which entries appended meanwhile by other spec files cannot enter (their ids are larger).
    const { author, project, revisionId } = await calcTeam(app);
    const draft = await revisionOf(author.session, revisionId);
    const input = { ...(draft.input as object), title: 'Saved before signing' };
    expect(
      (await author.session.put(`/api/revisions/${revisionId}`, { input, lockVersion: draft.lockVersion })).status,
    ).toBe(200);
    await sign(author.session, revisionId, 'authored');
    await sign(author.session, (await secondCalc(author, project.id, `G2-${revisionId}`)).body.latest.id, 'authored');
    const { session: auditor } = await signedInAs(app, ['compliance']);
    const newest = (await auditor.get('/api/audit?action=revision.&size=1')).body.items[0] as AuditRow;
    const expected = await sequelize.query<AuditRow>(
      "SELECT id, action FROM audit_events WHERE action LIKE 'revision.%' AND id <= ? ORDER BY id DESC LIMIT 12",
      { replacements: [newest.id], type: QueryTypes.SELECT },
    );

    // Act: four pages of three by keyset, from just above the window's newest entry
    const walked: AuditRow[] = [];
    let after: string | null = String(newest.id + 1);
    while (after && walked.length < 12) {
      const page = await auditor.get(`/api/audit?action=revision.&size=3&after=${after}`);
      walked.push(...(page.body.items as AuditRow[]).map(({ id, action }) => ({ id, action })));
      after = page.body.next;
    }

    // Assert
    expect(new Set(expected.map((e) => e.action)).size).toBeGreaterThan(1);
    expect(walked).toEqual(expected.map(({ id, action }) => ({ id: Number(id), action })));
  });

  it('when "from" is after "to", then it is a 400 naming the field', async () => {
    const { session: auditor } = await signedInAs(app, ['compliance']);
    const res = await auditor.get('/api/audit?from=2026-12-05&to=2026-12-01');
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors['query.from']).toBeDefined();
  });

  it.each([
    ['an action naming the table', { action: 'x FROM `audit_events` AS `AuditEvent`' }],
    ['a record type with WHERE in it, within a project, by action', { entityType: 'a WHERE b', action: 'revision.' }],
    ['quotes, a question mark and a backslash', { action: "it's? \\ x", entityType: '`?`' }],
  ])('when a filter holds %s, then the page is answered, empty and counted as none', async (_, filter) => {
    const { project } = await calcTeam(app);
    const { session: auditor } = await signedInAs(app, ['compliance']);
    const q = new URLSearchParams({ ...filter, projectId: String(project.id), size: '50' });

    const res = await auditor.get(`/api/audit?${q}`);

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ items: [], total: 0, totalIsAtLeast: false, next: null });
  });

  it.each([
    ['userId=-1', 'userId', 'Person'],
    ['calcId=1e309', 'calcId', 'Calc'],
    ['projectId=__proto__', 'projectId', 'Project'],
  ])('when the address says %s, then 400 naming the filter as the screen does', async (query, field, label) => {
    const { session: auditor } = await signedInAs(app, ['compliance']);

    const res = await auditor.get(`/api/audit?${query}`);

    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({ [`query.${field}`]: ['must be a whole number from 1'] });
    expect(res.body.message).toBe(`Invalid input — ${label}: must be a whole number from 1`);
  });
});

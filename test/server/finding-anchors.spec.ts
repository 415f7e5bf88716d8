import { startTestApp } from '../support/api-harness';
import { advanceTo, revisionOf } from '../support/calc-harness';
import { findingsTeam } from '../support/findings-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());
// Each step signs in or signs with a password (Argon2) on a shared two-core machine: allow whole workflows.

type Row = { clauseId: string; status: string; location: { scope: string; index: number | null } };

async function inCheck() {
  const t = await findingsTeam(app);
  await advanceTo('in_check', t.sessions, t.revisionId);
  const revision = await revisionOf(t.sessions.checker, t.revisionId);
  const row = (revision.checklist.rows as Row[]).find(
    (r) => r.location.index !== null && r.status !== 'not-applicable',
  )!;
  return { ...t, row, path: `${row.location.scope}s[${row.location.index}]` };
}

describe('a finding is tied to a checklist row or a named input', () => {
  it("when the checker raises a finding on a checklist row, then the clause and the row's location are stored and returned", async () => {
    // Arrange
    const t = await inCheck();

    // Act
    const res = await t.checker.session.post(`/api/revisions/${t.revisionId}/findings`, {
      text: 'This row needs a source',
      clauseRef: t.row.clauseId,
      anchorPath: t.path,
    });

    // Assert
    expect(res.status).toBe(201);
    expect(res.body.findings).toEqual([
      expect.objectContaining({ clauseRef: t.row.clauseId, anchorPath: t.path, status: 'open' }),
    ]);
  });

  it('when the checker raises a finding on a named input, then the input path is stored without a clause', async () => {
    const t = await inCheck();

    const res = await t.checker.session.post(`/api/revisions/${t.revisionId}/findings`, {
      text: 'Diameter differs from the drawing',
      anchorPath: 'segments[0].od',
    });

    expect(res.status).toBe(201);
    expect(res.body.findings).toEqual([expect.objectContaining({ clauseRef: null, anchorPath: 'segments[0].od' })]);
  });

  it.each([
    ['a clause the standard does not have', { clauseRef: '99.9' }, 'clauseRef', /§99\.9 is not a clause/],
    [
      'a row location the clause is not checked at',
      { clauseRef: '__ROW__', anchorPath: 'segments[40]' },
      'anchorPath',
      /is not checked at that location/,
    ],
    [
      'an input the calc does not hold',
      { anchorPath: 'segments[40].od' },
      'anchorPath',
      /an input this revision does not have/,
    ],
    ['a path that is no input path', { anchorPath: 'segments[0]..od' }, 'anchorPath', /Concerns: must name an input/],
  ] as const)(
    'when the anchor names %s, then it is refused with 400 naming the field',
    async (_what, anchor, field, message) => {
      const t = await inCheck();
      const body = {
        text: 'Check this',
        ...anchor,
        ...('clauseRef' in anchor && anchor.clauseRef === '__ROW__' ? { clauseRef: t.row.clauseId } : {}),
      };

      const res = await t.checker.session.post(`/api/revisions/${t.revisionId}/findings`, body);

      expect(res.status).toBe(400);
      expect(Object.keys(res.body.fieldErrors)).toEqual([field]);
      expect(res.body.message).toMatch(message);
      expect((await revisionOf(t.sessions.checker, t.revisionId)).findings).toEqual([]);
    },
  );
});

describe('returning to the author', () => {
  const returnWith = async (t: Awaited<ReturnType<typeof inCheck>>, reason: string) =>
    t.checker.session.post(`/api/revisions/${t.revisionId}/return`, {
      reason,
      lockVersion: (await revisionOf(t.sessions.checker, t.revisionId)).lockVersion,
    });

  it('when open findings go back with the calc, then the reason does not become another finding to answer', async () => {
    const t = await inCheck();
    await t.checker.session.post(`/api/revisions/${t.revisionId}/findings`, {
      text: 'Kts needs its chart',
      clauseRef: t.row.clauseId,
      anchorPath: t.path,
    });

    const res = await returnWith(t, 'See the finding on the keyseat row');

    expect(res.status).toBe(200);
    expect(res.body.status).toBe('returned');
    expect(res.body.findings.map((f: { text: string }) => f.text)).toEqual(['Kts needs its chart']);
  });

  it('when nothing is open, then the reason becomes the one finding the author answers', async () => {
    const t = await inCheck();

    const res = await returnWith(t, 'Name the chart behind the keyseat Kts');

    expect(res.body.findings).toEqual([
      expect.objectContaining({
        text: 'Name the chart behind the keyseat Kts',
        status: 'open',
        clauseRef: null,
        anchorPath: null,
      }),
    ]);
  });
});

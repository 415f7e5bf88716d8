import { startTestApp } from '../support/api-harness';
import { calcTeam, sign } from '../support/calc-harness';
import { signedInAs } from '../support/api-harness';

const { app, sequelize } = startTestApp();
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

  it('when "from" is after "to", then it is a 400 naming the field', async () => {
    const { session: auditor } = await signedInAs(app, ['compliance']);
    const res = await auditor.get('/api/audit?from=2026-12-05&to=2026-12-01');
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors['query.from']).toBeDefined();
  });
});

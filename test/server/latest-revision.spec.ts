import { startTestApp } from '../support/api-harness';
import { calcTeam } from '../support/calc-harness';

// The calc page reads the calc and its newest revision side by side: the second read must answer exactly as
// GET /api/revisions/:id does for that revision.
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

describe('GET /api/calcs/:id/latest-revision', () => {
  it("when a reader asks for a calc's newest revision, then it is the revision read by its own id", async () => {
    const { author, calc, revisionId } = await calcTeam(app);
    const latest = await author.session.get(`/api/calcs/${calc.id}/latest-revision`);
    const byId = await author.session.get(`/api/revisions/${revisionId}`);
    expect(latest.status).toBe(200);
    expect(latest.body).toEqual(byId.body);
  });

  it('when the calc does not exist, then it is 404; when the id is not a number, then 400 naming params.id', async () => {
    const { author } = await calcTeam(app);
    expect((await author.session.get('/api/calcs/999999999/latest-revision')).status).toBe(404);
    const bad = await author.session.get('/api/calcs/07/latest-revision');
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fieldErrors)).toEqual(['params.id']);
  });
});

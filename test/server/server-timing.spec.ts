import { startTestApp, signedInAs } from '../support/api-harness';
import { calcTeam } from '../support/calc-harness';

// Speed is measured, not asserted: the header is there to read in the browser's network panel.
// Phases are off by default, and in npm test (SERVER_TIMING_PHASES, server/config.ts): both are set here.
const { app, sequelize } = startTestApp({ SERVER_TIMING_PHASES: false });
const phased = startTestApp({ SERVER_TIMING_PHASES: true });
afterAll(async () => {
  await sequelize.close();
  await phased.sequelize.close();
});

describe('server timing', () => {
  it('when a screen loads its data, then each answer says how long the server took (Server-Timing)', async () => {
    const { session } = await signedInAs(app, ['author'], 'timing');
    const res = await session.get('/api/dashboard');
    expect(res.headers['server-timing']).toMatch(/^app;dur=\d+(\.\d)?$/);
  });

  it('when phases are not switched on, then a revision read gives its whole time only', async () => {
    const { author, revisionId } = await calcTeam(app);
    const res = await author.session.get(`/api/revisions/${revisionId}`);
    expect(res.status).toBe(200);
    expect(res.headers['server-timing']).toMatch(/^app;dur=\d+(\.\d)?$/);
  });

  it('when phases are switched on and a revision is read, then the answer names the time of each phase', async () => {
    const { author, revisionId } = await calcTeam(phased.app);
    const res = await author.session.get(`/api/revisions/${revisionId}`);
    const phases = String(res.headers['server-timing']).split(', ');
    expect(phases[0]).toMatch(/^app;dur=/);
    expect(phases.map((p) => p.split(';')[0]).sort()).toEqual([
      'app',
      'hash',
      'input',
      'names',
      'read',
      'verification',
    ]);
    for (const p of phases) expect(p).toMatch(/^[a-z]+;dur=\d+\.\d$/);
  });
});

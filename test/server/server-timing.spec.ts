import { startTestApp, signedInAs } from '../support/api-harness';

// Speed is measured, not asserted: the header is there to read in the browser's network panel.
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

describe('server timing', () => {
  it('when a screen loads its data, then each answer says how long the server took (Server-Timing)', async () => {
    const { session } = await signedInAs(app, ['author'], 'timing');
    const res = await session.get('/api/dashboard');
    expect(res.headers['server-timing']).toMatch(/^app;dur=\d+(\.\d)?$/);
  });
});

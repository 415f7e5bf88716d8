import request from 'supertest';
import { startTestApp, createTestUser, signedInAgent } from '../support/api-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

describe('sign-in', () => {
  it('when an admin signs in, then the session carries their rules', async () => {
    const admin = await createTestUser(['admin']);
    const s = await signedInAgent(app, admin.username);
    expect(s.login.body.user.roles).toEqual(['admin']);
    expect((await s.get('/api/users')).status).toBe(200);
  });
  it('when nobody is signed in, then the API answers 401', async () => {
    expect((await request(app).get('/api/users')).status).toBe(401);
  });
});

import request from 'supertest';
import { sessionCookieOf, signedInAs, startTestApp, uniqueCode } from '../support/api-harness';

// Its own file: each startTestApp() binds the models to its Sequelize, and this test closes one.
describe('sessions across a restart', () => {
  it('when the app is rebuilt on a new connection pool, then the old cookie and CSRF token still work', async () => {
    const before = startTestApp();
    const { user, session } = await signedInAs(before.app, ['admin']);
    const cookie = sessionCookieOf(session.login);
    await before.sequelize.close();

    const after = startTestApp();
    try {
      // Write first: GET /api/session would hand out a new CSRF token and retire the old one.
      const write = await request(after.app)
        .post('/api/projects')
        .set('Cookie', cookie)
        .set('x-csrf-token', session.csrf)
        .send({ code: uniqueCode('RS'), name: 'Restart-proof shaft' });
      const who = await request(after.app).get('/api/session').set('Cookie', cookie);

      expect(who.body.user).toEqual(expect.objectContaining({ id: user.id }));
      expect(write.status).toBe(201);
    } finally {
      await after.sequelize.close();
    }
  });
});

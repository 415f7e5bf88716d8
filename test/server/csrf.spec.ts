import request from 'supertest';
import {
  anonymousAgent,
  createTestUser,
  signedInAs,
  startTestApp,
  TEST_PASSWORD,
  uniqueCode,
} from '../support/api-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

const projectBody = () => ({ code: uniqueCode('CSRF'), name: 'Mixer shaft' });
const CSRF_REFUSAL = expect.objectContaining({
  code: 'csrf_invalid',
  message: expect.stringMatching(/security token/),
});

describe('CSRF protection', () => {
  it('when a signed-in write carries no token, then it is refused with 403', async () => {
    const { session } = await signedInAs(app, ['admin']);

    const res = await session.agent.post('/api/projects').send(projectBody());

    expect(res.status).toBe(403);
    expect(res.body).toEqual(CSRF_REFUSAL);
  });

  // Signing in regenerates the session (against session fixation), which retires the old token.
  it('when the token is the one from before sign-in, then it is stale and refused', async () => {
    const user = await createTestUser(['admin']);
    const { agent, token: before } = await anonymousAgent(app);
    await agent
      .post('/api/auth/login')
      .set('x-csrf-token', before)
      .send({ username: user.username, password: TEST_PASSWORD });

    const res = await agent.post('/api/projects').set('x-csrf-token', before).send(projectBody());

    expect(res.status).toBe(403);
    expect(res.body).toEqual(CSRF_REFUSAL);
  });

  it("when the token belongs to another person's session, then it is refused", async () => {
    const { session: mine } = await signedInAs(app, ['admin']);
    const { session: theirs } = await signedInAs(app, ['admin']);

    const res = await mine.agent.post('/api/projects').set('x-csrf-token', theirs.csrf).send(projectBody());

    expect(res.status).toBe(403);
  });

  it('when the token is right, then the same write goes through', async () => {
    const { session } = await signedInAs(app, ['admin']);
    const res = await session.post('/api/projects', projectBody());
    expect(res.status).toBe(201);
  });

  it('when a sign-in carries no token, then it is refused before any password check', async () => {
    const user = await createTestUser(['author']);
    const res = await request(app).post('/api/auth/login').send({ username: user.username, password: TEST_PASSWORD });
    expect(res.status).toBe(403);
  });

  it('when a read carries no token, then it is served', async () => {
    const { session } = await signedInAs(app, ['author']);
    expect((await session.agent.get('/api/projects')).status).toBe(200);
  });
});

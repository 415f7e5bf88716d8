import request from 'supertest';
import { Project } from '../../server/db/models';
import { createTestProject, signedInAs, startTestApp, uniqueCode } from '../support/api-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

describe('creating projects', () => {
  it('when an admin creates a project, then it is active with the defaults filled in', async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const code = uniqueCode('SP');

    const res = await admin.post('/api/projects', { code, name: 'Slurry pump drive shaft', client: 'Invented Mining' });

    expect(res.status).toBe(201);
    expect(res.body).toEqual(
      expect.objectContaining({ code, status: 'active', revisionScheme: 'letters', description: '', version: 0 }),
    );
  });

  it('when the code is already in use, then it is a 409 naming the code', async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const existing = await createTestProject();

    const res = await admin.post('/api/projects', { code: existing.code, name: 'Second with the same code' });

    expect(res.status).toBe(409);
    expect(res.body.fieldErrors).toEqual({ code: ['is already in use'] });
  });

  it.each([
    ['code', { code: 'lower-case', name: 'Valid name' }],
    ['code', { name: 'Valid name' }],
    ['name', { code: 'OK-1', name: 'ab' }],
    ['revisionScheme', { code: 'OK-2', name: 'Valid name', revisionScheme: 'roman' }],
  ])('when %s is not acceptable, then it is a 400 naming it', async (field, body) => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const res = await admin.post('/api/projects', body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors)).toEqual([field]);
  });
});

describe('reading projects', () => {
  // Archived projects leave daily work but stay on record for compliance and admins.
  it('when a project is archived, then authors no longer see it but compliance and admins still read it', async () => {
    const archived = await createTestProject({ status: 'archived' });
    const { session: author } = await signedInAs(app, ['author']);
    const { session: compliance } = await signedInAs(app, ['compliance']);
    const { session: admin } = await signedInAs(app, ['admin']);

    const [byAuthor, byCompliance, byAdmin] = await Promise.all([
      author.get(`/api/projects/${archived.id}`),
      compliance.get(`/api/projects/${archived.id}`),
      admin.get(`/api/projects/${archived.id}`),
    ]);

    expect(byAuthor.status).toBe(403);
    expect(byCompliance.status).toBe(200);
    expect(byAdmin.body.status).toBe('archived');
  });

  it('when the id is unknown, then it is a 404; when it is not a number, a 400', async () => {
    const { session } = await signedInAs(app, ['author']);

    const missing = await session.get('/api/projects/2147483000');
    const bad = await session.get('/api/projects/abc');

    expect(missing.status).toBe(404);
    expect(missing.body.message).toMatch(/Project 2147483000 was not found/);
    expect(bad.status).toBe(400);
    expect(bad.body.fieldErrors).toEqual({ 'params.id': ['must be a number'] });
  });

  it.each([
    ['an underscore where the code has another character', (code: string) => `${code.slice(0, 2)}_${code.slice(3)}`],
    ['a percent sign inside the code', (code: string) => `${code.slice(0, 2)}%${code.slice(3)}`],
  ])('when the search holds %s, then it is taken literally, not as a wildcard', async (_what, typed) => {
    const project = await createTestProject();
    const { session } = await signedInAs(app, ['author']);
    const found = async (q: string) =>
      (await session.get(`/api/projects?q=${encodeURIComponent(q)}&size=100`)).body.items.map(
        (p: { id: number }) => p.id,
      );

    expect(await found(project.code)).toEqual([project.id]);
    expect(await found(typed(project.code))).not.toContain(project.id);
  });

  it('when nobody is signed in, then reading a project is 401', async () => {
    const project = await createTestProject();
    expect((await request(app).get(`/api/projects/${project.id}`)).status).toBe(401);
  });
});

describe('updating projects', () => {
  it('when an admin archives a project, then the change and the new version come back', async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const project = await createTestProject();

    const res = await admin.patch(`/api/projects/${project.id}`, { status: 'archived', version: project.version });

    expect(res.status).toBe(200);
    expect(res.body).toEqual(expect.objectContaining({ status: 'archived', version: project.version + 1 }));
  });

  it('when two admins PATCH the same project from the same version, then the second gets 409', async () => {
    const { session: first } = await signedInAs(app, ['admin']);
    const { session: second } = await signedInAs(app, ['admin']);
    const project = await createTestProject();

    const a = await first.patch(`/api/projects/${project.id}`, { name: 'First rename', version: project.version });
    const b = await second.patch(`/api/projects/${project.id}`, { name: 'Second rename', version: project.version });

    expect([a.status, b.status]).toEqual([200, 409]);
    expect(b.body.code).toBe('conflict');
    expect((await Project.findByPk(project.id))!.name).toBe('First rename');
  });

  it.each([
    // Calc numbers are built on the project code, so once issued it never changes.
    ['code', { code: 'NEW-CODE', version: 0 }],
    ['version', { name: 'No version given' }],
    ['status', { status: 'deleted', version: 0 }],
  ])('when the PATCH has a bad %s, then it is a 400 naming it', async (field, body) => {
    const { session: admin } = await signedInAs(app, ['admin']);
    const project = await createTestProject();
    const res = await admin.patch(`/api/projects/${project.id}`, body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors)).toEqual([field]);
  });

  it('when the project does not exist, then the PATCH is a 404', async () => {
    const { session: admin } = await signedInAs(app, ['admin']);
    expect((await admin.patch('/api/projects/2147483000', { name: 'Nobody home', version: 0 })).status).toBe(404);
  });
});

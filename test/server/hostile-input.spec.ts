import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { Finding, Project, Revision } from '../../server/db/models';
import { signedInAs, startTestApp, uniqueCode } from '../support/api-harness';
import { calcTeam, revisionOf } from '../support/calc-harness';

// Bad input at the edge: every case is a 400 (or 413/415) naming the field, and nothing is stored.
// The app that serves a client build is made first: the models bind to the last app made.
const dist = fs.mkdtempSync(path.join(os.tmpdir(), 'tt-dist-'));
fs.writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>t</title>');
const withClient = startTestApp({ CLIENT_DIST: dist });
const { app, sequelize } = startTestApp();
afterAll(async () => {
  await sequelize.close();
  await withClient.sequelize.close();
  fs.rmSync(dist, { recursive: true, force: true });
});

type Session = Awaited<ReturnType<typeof signedInAs>>['session'];
let admin: Session;
beforeAll(async () => {
  ({ session: admin } = await signedInAs(app, ['admin']));
});

const rawJson = (s: Session, method: 'post' | 'put', url: string, text: string | Buffer, type = 'application/json') =>
  s.agent[method](url).set('x-csrf-token', s.csrf).set('Content-Type', type).send(text);

const expectNoStack = (body: unknown) => expect(JSON.stringify(body)).not.toMatch(/\.ts:\d+|\bat \w+ \(|TypeError/);

describe('JSON bodies', () => {
  it.each(['__proto__', 'constructor', 'prototype'])(
    'when a body has a top-level %s key, then it is a 400 naming that key',
    async (key) => {
      const res = await rawJson(
        admin,
        'post',
        '/api/projects',
        `{"code":"PROTO-1","name":"Proto","${key}":{"isAdmin":true}}`,
      );
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.fieldErrors)).toEqual([key]);
      expectNoStack(res.body);
      expect(await Project.count({ where: { code: 'PROTO-1' } })).toBe(0);
    },
  );

  it('when a nested key is __proto__, then the 400 names its full path', async () => {
    const res = await rawJson(
      admin,
      'post',
      '/api/projects',
      '{"code":"PROTO-2","name":"Proto","meta":{"a":[{"__proto__":1}]}}',
    );
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({ 'meta.a[0].__proto__': ['is not an accepted field name'] });
  });

  it('when a key appears twice, then it is a 400 naming it, not a silent last-one-wins', async () => {
    const res = await rawJson(admin, 'post', '/api/projects', '{"code":"DUP-1","name":"One","name":"Two"}');
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({ name: [expect.stringMatching(/appears twice in one object/)] });
  });

  it('when a body is not UTF-8 or not in UTF-8, then it is refused, never altered', async () => {
    const bad = Buffer.concat([Buffer.from('{"code":"UTF-1","name":"'), Buffer.from([0xc3, 0x28]), Buffer.from('"}')]);
    expect((await rawJson(admin, 'post', '/api/projects', bad)).status).toBe(400);
    expect(
      (await rawJson(admin, 'post', '/api/projects', '{"code":"UTF-2"}', 'application/json; charset=latin1')).status,
    ).toBe(415);
  });
});

describe('draft input at the edge', () => {
  let team: Awaited<ReturnType<typeof calcTeam>>;
  beforeAll(async () => {
    team = await calcTeam(app);
  });

  async function saveRaw(inputText: string) {
    const before = await revisionOf(team.author.session, team.revisionId);
    const res = await rawJson(
      team.author.session,
      'put',
      `/api/revisions/${team.revisionId}`,
      `{"lockVersion":${before.lockVersion},"input":${inputText}}`,
    );
    const after = await Revision.findByPk(team.revisionId);
    return { res, before, after: after! };
  }

  it('when a number is beyond double range (1e309), then it is a 400 naming the field and nothing is saved', async () => {
    const input = JSON.stringify((await revisionOf(team.author.session, team.revisionId)).input).replace(
      /"od":\s*[0-9.eE+-]+/,
      '"od":1e309',
    );
    const { res, before, after } = await saveRaw(input);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors)).toEqual(['input.segments[0].od']);
    expect(res.body.fieldErrors['input.segments[0].od'][0]).toMatch(/beyond the range/);
    expect(after.lockVersion).toBe(before.lockVersion);
  });

  it.each([1000, 5000, 100_000])(
    'when the input is nested %i deep, then it is a 400 naming where, not a stack overflow',
    async (depth) => {
      const { res, before, after } = await saveRaw(`{"notes":${'['.repeat(depth)}${']'.repeat(depth)}}`);
      expect(res.status).toBe(400);
      expect(Object.values(res.body.fieldErrors).flat()[0]).toMatch(/nested deeper than \d+ levels/);
      expect(Object.keys(res.body.fieldErrors)[0]).toMatch(/^input\.notes(\[0\])+$/);
      expect(after.lockVersion).toBe(before.lockVersion);
      expectNoStack(res.body);
    },
  );
});

describe('stored documents', () => {
  it('when a draft input is within the body limits but deeper than a calc input can be, then the 400 names where', async () => {
    const team = await calcTeam(app);
    const r = await revisionOf(team.author.session, team.revisionId);
    const res = await rawJson(
      team.author.session,
      'put',
      `/api/revisions/${team.revisionId}`,
      `{"lockVersion":${r.lockVersion},"input":{"notes":${'['.repeat(20)}${']'.repeat(20)}}}`,
    );
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({ [`input.notes${'[0]'.repeat(11)}`]: ['is nested deeper than 12 levels'] });
  });
});

describe('text fields', () => {
  it('when finding text holds a lone surrogate, then it is a 400 naming text, and no finding is stored', async () => {
    const team = await calcTeam(app);
    const before = await Finding.count({ where: { revisionId: team.revisionId } });
    const res = await rawJson(
      team.checker.session,
      'post',
      `/api/revisions/${team.revisionId}/findings`,
      '{"text":"Fillet radius \\ud800 too small"}',
    );
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({ text: [expect.stringMatching(/lone surrogate/)] });
    expect(await Finding.count({ where: { revisionId: team.revisionId } })).toBe(before);
  });

  it('when a surrogate pair is whole (an emoji), then it is accepted', async () => {
    const res = await admin.post('/api/projects', { code: uniqueCode('EMO'), name: 'Pump shaft \u{1F527}' });
    expect(res.status).toBe(201);
  });
});

describe('ids in paths', () => {
  it.each(['0x10', '1e1', '%207', '+7', '07', '1.0', '-1', '99999999999999999999'])(
    'when the id is %s, then it is a 400 naming id',
    async (id) => {
      const res = await admin.get(`/api/projects/${id}`);
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.fieldErrors)).toEqual(['params.id']);
    },
  );

  it('when a query id is written in hex, then it is a 400 too', async () => {
    const res = await admin.get('/api/calcs?projectId=0x10');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors)).toEqual(['query.projectId']);
  });
});

describe('paths and multipart bodies', () => {
  it('when an API path has a bad percent-encoding, then it is a 400', async () => {
    const res = await admin.get('/api/projects/%c0%ae%c0%ae');
    expect(res.status).toBe(400);
    expectNoStack(res.body);
  });

  it('when a page path has a bad percent-encoding, then it is a 400, not a 500', async () => {
    const res = await request(withClient.app).get('/%c0%ae%c0%ae/x');
    expect(res.status).toBe(400);
    expect((await request(withClient.app).get('/projects/1')).status).toBe(200);
  });

  const boundary = 'XyZzY';
  const multipart = (s: Session, url: string, body: string) =>
    s.agent
      .post(url)
      .set('x-csrf-token', s.csrf)
      .set('Content-Type', `multipart/form-data; boundary=${boundary}`)
      .send(body);

  it.each([
    [
      'a malformed part header',
      `--${boundary}\r\nContent-Disposition form-data; name="file"\r\n\r\nabc\r\n--${boundary}--\r\n`,
    ],
    [
      'an unexpected end of form',
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="a.zip"\r\n\r\nabc`,
    ],
  ])('when an evidence pack upload has %s, then it is a 400 naming file', async (_what, body) => {
    const res = await multipart(admin, '/api/verify/pack', body);
    expect([res.status, res.body.code]).toEqual([400, 'validation']);
    expect(Object.keys(res.body.fieldErrors)).toEqual(['file']);
  });

  it('when an attachment upload is cut short, then it is a 400 and nothing is stored', async () => {
    const team = await calcTeam(app);
    const res = await multipart(
      team.author.session,
      `/api/revisions/${team.revisionId}/attachments`,
      `--${boundary}\r\nContent-Disposition: form-data; name="kind"\r\n\r\ndrawing\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="a.pdf"\r\n\r\n%PDF-1.4`,
    );
    expect(res.status).toBe(400);
    expect((await team.author.session.get(`/api/revisions/${team.revisionId}/attachments`)).body.items).toEqual([]);
  });

  it('when a multipart text field is not valid UTF-8, then it is a 400 naming that field, never stored altered', async () => {
    const team = await calcTeam(app);
    const body = Buffer.concat([
      Buffer.from(
        `--${boundary}\r\nContent-Disposition: form-data; name="kind"\r\n\r\ndrawing\r\n--${boundary}\r\nContent-Disposition: form-data; name="note"\r\n\r\nsheet `,
      ),
      Buffer.from([0xed, 0xa0, 0x80]), // a UTF-16 surrogate written as if it were UTF-8
      Buffer.from(
        `\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="a.pdf"\r\n\r\n%PDF-1.4 x\r\n--${boundary}--\r\n`,
      ),
    ]);
    const res = await team.author.session.agent
      .post(`/api/revisions/${team.revisionId}/attachments`)
      .set('x-csrf-token', team.author.session.csrf)
      .set('Content-Type', `multipart/form-data; boundary=${boundary}`)
      .send(body);
    expect([res.status, res.body.fieldErrors]).toEqual([
      400,
      { note: ['is not valid UTF-8 text; nothing was stored'] },
    ]);
  });
});

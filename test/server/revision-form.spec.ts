import { isDeepStrictEqual } from 'node:util';
import { QueryTypes } from 'sequelize';
import { advanceTo, calcTeam, fixtureInput, type Team } from '../support/calc-harness';
import { anonymousAgent, expectStatus, startTestApp, type Session } from '../support/api-harness';
import { modelTeam } from '../support/model-harness';
import { ENGINE_VERSION } from '../../shared/engine';
import { FIELDS } from '../../shared/engine/fields';
import { METHODS } from '../../shared/engine/methods';
import type { EngineMetadata } from '../../shared/engine/stored-result';
import {
  REVISION_FORM_HEADER,
  STORED_FORM,
  expandRevision,
  metadataVersionOf,
  type StoredRevisionDto,
} from '../../shared/schemas/revision-form';
import { expandChecklist } from '../../server/calcs/stored-checklist';
import { expandResult } from '../../server/calcs/stored-result';

/*
 * The browser reads a revision with its result and checklist as stored and expands them itself
 * (shared/schemas/revision-form.ts); every other reader is answered in full. Both must say the same thing: the
 * stored form, expanded with the engine version's recorded metadata, is deep-equal to the full answer.
 */
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

const full = (s: Session, url: string) => s.agent.get(url);
const stored = (s: Session, url: string) => s.agent.get(url).set(REVISION_FORM_HEADER, STORED_FORM);

/** The metadata the browser reads for a version, through the API. */
async function metadataFor(s: Session, read: StoredRevisionDto): Promise<EngineMetadata | null> {
  const version = metadataVersionOf(read);
  if (version === null) return null;
  const res = expectStatus(await s.get(`/api/engine-metadata/${version}`), 200, 'engine metadata');
  return res.body as EngineMetadata;
}

/** Reads `url` in both forms and holds the expanded stored form equal to the full one; gives both. */
async function bothForms(s: Session, url: string) {
  const whole = expectStatus(await full(s, url), 200, `full read of ${url}`);
  const compact = expectStatus(await stored(s, url), 200, `stored read of ${url}`);
  const read = compact.body as StoredRevisionDto;
  expect(expandRevision(read, await metadataFor(s, read))).toEqual(whole.body);
  return { whole: whole.body, compact: read, text: compact.text, fullText: whole.text };
}

const rewriteRow = (revisionId: number, columns: { result?: string | null; checklist?: string | null }) =>
  sequelize.query(
    `UPDATE revisions SET ${Object.keys(columns)
      .map((c) => `${c} = ?`)
      .join(', ')} WHERE id = ?`,
    { replacements: [...Object.values(columns), revisionId] },
  );
const rowOf = async (revisionId: number) =>
  (
    await sequelize.query<{ result: string; checklist: string }>(
      'SELECT result, checklist FROM revisions WHERE id = ?',
      { replacements: [revisionId], type: QueryTypes.SELECT },
    )
  )[0];

describe('a revision read in the stored form', () => {
  it('sends the result without units and formulas and the checklist rows as stored, about half the bytes', async () => {
    const t = await calcTeam(app);
    const { whole, compact, text, fullText } = await bothForms(t.author.session, `/api/revisions/${t.revisionId}`);
    expect(compact.result).not.toHaveProperty('fields');
    expect(compact.result).not.toHaveProperty('methods');
    expect(compact.checklist?.storedRows?.form).toBe(1);
    expect(compact.result).toEqual(JSON.parse((await rowOf(t.revisionId)).result));
    expect(compact.checklist).toEqual(JSON.parse((await rowOf(t.revisionId)).checklist));
    expect((whole as { result: { fields: unknown } }).result.fields).toEqual(FIELDS.SI);
    expect(text.length).toBeLessThan(0.7 * fullText.length);
  });

  it('answers a calc’s newest revision the same way, and says it varies by the form asked for', async () => {
    const t = await calcTeam(app);
    await bothForms(t.author.session, `/api/calcs/${t.calc.id}/latest-revision`);
    const res = await stored(t.author.session, `/api/revisions/${t.revisionId}`);
    expect(res.headers['vary']).toMatch(/Revision-Form/i);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    expect(res.headers['cache-control']).toBe('private, no-store');
  });

  it('answers a save in the form asked for: the stored answer expands to the full read of the saved revision', async () => {
    const t = await calcTeam(app);
    const url = `/api/revisions/${t.revisionId}`;
    const before = (await full(t.author.session, url)).body as { lockVersion: number };
    const input = fixtureInput();
    (input['segments'] as { od: number }[])[0].od = 61;
    const saved = expectStatus(
      await t.author.session.agent
        .put(url)
        .set('x-csrf-token', t.author.session.csrf)
        .set(REVISION_FORM_HEADER, STORED_FORM)
        .send({ input, lockVersion: before.lockVersion }),
      200,
      'save in the stored form',
    );
    const read = saved.body as StoredRevisionDto;
    expect(read.result).not.toHaveProperty('fields');
    expect(read.checklist?.storedRows).toBeDefined();
    const now = await full(t.author.session, url);
    expect(expandRevision(read, await metadataFor(t.author.session, read))).toEqual(now.body);
    // Without the header, a save is answered in full, as before.
    const again = await t.author.session.put(url, { input, lockVersion: now.body.lockVersion });
    expect(again.body.result.fields).toEqual(FIELDS.SI);
  });

  it('holds each signature as valid, and shows a stored result changed behind the app’s back as breaking them', async () => {
    const team = await calcTeam(app);
    const sessions: Team = {
      author: team.author.session,
      checker: team.checker.session,
      approver: team.approver.session,
    };
    await advanceTo('approved', sessions, team.revisionId);
    const url = `/api/revisions/${team.revisionId}`;
    const before = await bothForms(team.approver.session, url);
    expect(before.compact.signatures.map((s) => s.isValid)).toEqual([true, true, true]);
    // A value changed in the stored text (valid JSON still): every signature covering it breaks, in both forms.
    const row = await rowOf(team.revisionId);
    const changed = JSON.parse(row.result);
    changed.length = changed.length + 1;
    await rewriteRow(team.revisionId, { result: JSON.stringify(changed) });
    const after = await bothForms(team.approver.session, url);
    expect(after.compact.signatures.map((s) => s.isValid)).toEqual([false, false, false]);
    expect(after.compact.result).toEqual(changed);
  });

  it('sends a row stored whole (units and formulas in place, rows as objects) as it is', async () => {
    const t = await calcTeam(app);
    const row = await rowOf(t.revisionId);
    const wholeResult = await expandResult(sequelize, row.result);
    const wholeChecklist = expandChecklist(row.checklist);
    await rewriteRow(t.revisionId, { result: JSON.stringify(wholeResult), checklist: JSON.stringify(wholeChecklist) });
    const { compact } = await bothForms(t.author.session, `/api/revisions/${t.revisionId}`);
    expect(metadataVersionOf(compact)).toBeNull();
    expect(compact.result).toEqual(wholeResult);
    expect(compact.checklist).toEqual(wholeChecklist);
  });

  it('sends no result and no checklist for input that cannot be evaluated, with the same issues', async () => {
    const input = fixtureInput();
    (input['segments'] as { od: number }[])[0].od = 1e200;
    const t = await calcTeam(app, input);
    const { compact } = await bothForms(t.author.session, `/api/revisions/${t.revisionId}`);
    expect(compact.result).toBeNull();
    expect(compact.verdict).toBeNull();
    expect(compact.inputIssues.length).toBeGreaterThan(0);
  });

  it('shows a checker who works blind none of the author’s numbers, as the full read does', async () => {
    const t = await modelTeam(app);
    const { compact, text } = await bothForms(t.checker.session, `/api/revisions/${t.revisionId}`);
    expect(compact.verification?.blind).toBe(true);
    expect(compact.result).toBeNull();
    expect(compact.checklist).toBeNull();
    expect(compact.input).toEqual({});
    const row = await rowOf(t.revisionId);
    const someValue = String(JSON.parse(row.result).length);
    expect(text).not.toContain(`"length":${someValue}`);
  });

  it.each([
    ['text that is not JSON', 'draft', '{"length": 12'],
    ['JSON with more after it', 'draft', '{"length":12},"verdict":"compliant","x":{"y":1}'],
    // Signed: the texts a remembered hash was computed from are not parsed again, and these are other texts.
    ['text that is not JSON', 'approved', '{"length": 12'],
    ['JSON with more after it', 'approved', '{"length":12},"verdict":"compliant","x":{"y":1}'],
  ])(
    'never splices a stored result that is %s into an answer (%s): both forms fail alike',
    async (_what, state, text) => {
      const t = await calcTeam(app);
      if (state === 'approved') {
        const sessions: Team = { author: t.author.session, checker: t.checker.session, approver: t.approver.session };
        await advanceTo('approved', sessions, t.revisionId);
        await bothForms(t.approver.session, `/api/revisions/${t.revisionId}`);
      }
      await rewriteRow(t.revisionId, { result: text });
      const url = `/api/revisions/${t.revisionId}`;
      const whole = await full(t.author.session, url);
      const compact = await stored(t.author.session, url);
      expect(compact.status).toBe(whole.status);
      expect(compact.status).toBeGreaterThanOrEqual(500);
      expect(compact.text).not.toContain('compliant');
      expect(() => JSON.parse(compact.text)).not.toThrow();
    },
  );

  it('is not the answer of a reader who asks nothing, or asks for another form', async () => {
    const t = await calcTeam(app);
    const url = `/api/revisions/${t.revisionId}`;
    for (const res of [
      await full(t.author.session, url),
      await t.author.session.agent.get(url).set(REVISION_FORM_HEADER, 'expanded'),
    ]) {
      expect(res.body.result.fields).toEqual(FIELDS.SI);
      expect(res.body.checklist.storedRows).toBeUndefined();
      expect(isDeepStrictEqual(Object.keys(res.body.checklist.rows[0]).slice(0, 2), ['clauseId', 'clauseTitle'])).toBe(
        true,
      );
    }
  });
});

describe('an engine version’s units and formulas', () => {
  it('are answered as recorded, kept by the browser, for a signed-in reader', async () => {
    const t = await calcTeam(app);
    const res = expectStatus(await t.author.session.get(`/api/engine-metadata/${ENGINE_VERSION}`), 200, 'metadata');
    expect(res.body).toEqual({ engineVersion: ENGINE_VERSION, fields: FIELDS, methods: METHODS });
    expect(res.headers['cache-control']).toBe('private, max-age=86400, immutable');
  });

  it('are a 404 for a version that stored nothing, a 400 naming the version for a malformed one, a 401 signed out', async () => {
    const t = await calcTeam(app);
    expect((await t.author.session.get('/api/engine-metadata/0.0.1')).status).toBe(404);
    const bad = await t.author.session.get('/api/engine-metadata/2.0.0%3Bdrop');
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fieldErrors)).toEqual(['params.version']);
    const { agent } = await anonymousAgent(app);
    expect((await agent.get(`/api/engine-metadata/${ENGINE_VERSION}`)).status).toBe(401);
  });
});

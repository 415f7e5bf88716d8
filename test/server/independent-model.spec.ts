import { fixtureInput, sign, tickAll } from '../support/calc-harness';
import { person, expectStatus, startTestApp } from '../support/api-harness';
import { auditOf } from '../support/audit-harness';
import { independentModelBlocker } from '../../server/independent/signing-blocker';
import { differentInput, lockModel, modelTeam, modelUrl, revisionOf, saveModel } from '../support/model-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

describe('independent model: blind check, lock and comparison', () => {
  it("when a checker opens a revision that needs a model, then the author's input, results and checklist are left out until their model is locked", async () => {
    const t = await modelTeam(app);
    const blind = await revisionOf(t.checker.session, t.revisionId);
    expect(blind.verification).toEqual(
      expect.objectContaining({ blind: true, need: expect.objectContaining({ method: 'independent-model' }) }),
    );
    expect([blind.input, blind.result, blind.checklist, blind.verdict, blind.findings]).toEqual([
      {},
      null,
      null,
      null,
      [],
    ]);
    const calc = await t.checker.session.get(`/api/calcs/${blind.calcId}`);
    expect(calc.body.latest.verdict).toBeNull();
    const report = await t.checker.session.get(`/api/revisions/${t.revisionId}/report.pdf`);
    expect([403, 404]).toContain(report.status);

    await saveModel(t.checker.session, t.revisionId, fixtureInput());
    expect((await revisionOf(t.checker.session, t.revisionId)).verification.blind).toBe(true);
    const locked = await lockModel(t.checker.session, t.revisionId);
    expect(locked).toEqual(
      expect.objectContaining({ state: 'locked', agrees: true, modelHash: expect.stringMatching(/^[0-9a-f]{64}$/) }),
    );
    const seen = await revisionOf(t.checker.session, t.revisionId);
    expect([seen.verification.blind, seen.result !== null, seen.verification.model.agrees]).toEqual([
      false,
      true,
      true,
    ]);
  });

  it('when the models differ, then each difference is an open finding on its row with both values, and signing as checked waits until they are closed', async () => {
    const t = await modelTeam(app);
    await saveModel(t.checker.session, t.revisionId, differentInput());
    const locked = await lockModel(t.checker.session, t.revisionId);
    expect(locked.agrees).toBe(false);
    const rev = await revisionOf(t.author.session, t.revisionId);
    const od = rev.findings.find((f: { anchorPath: string }) => f.anchorPath === 'segments[1].od');
    expect(od.text).toMatch(/Segment 2 outer diameter: author's model \d+ mm, independent model \d+ mm/);
    await tickAll(t.checker.session, t.revisionId);
    const blocked = await sign(t.checker.session, t.revisionId, 'checked');
    expect(blocked.status).toBe(403);

    // The usual round: returned, answered by the author, resubmitted, closed by the checker.
    expectStatus(
      await t.checker.session.post(`/api/revisions/${t.revisionId}/return`, {
        reason: 'See the model differences',
        lockVersion: rev.lockVersion,
      }),
      200,
      'return',
    );
    for (const f of (await revisionOf(t.author.session, t.revisionId)).findings) {
      expectStatus(
        await t.author.session.post(`/api/findings/${f.id}/answer`, {
          answer: 'Drawing rev C gives the larger seat; calc kept, see note',
        }),
        200,
        'answer',
      );
    }
    expectStatus(await sign(t.author.session, t.revisionId, 'authored'), 200, 'resubmit');
    for (const f of (await revisionOf(t.checker.session, t.revisionId)).findings) {
      expectStatus(await t.checker.session.post(`/api/findings/${f.id}/close`, {}), 200, 'close');
    }
    const signed = expectStatus(await sign(t.checker.session, t.revisionId, 'checked'), 200, 'check').body;
    const byMeaning = Object.fromEntries(
      signed.signatures.map((s: { meaning: string; contentFormat: number; isValid: boolean }) => [
        s.meaning,
        [s.contentFormat, s.isValid],
      ]),
    );
    expect(byMeaning.checked).toEqual([3, true]);
    expect(signed.signatures.every((s: { isValid: boolean }) => s.isValid)).toBe(true);
    expect(signed.verification.signed).toEqual(expect.objectContaining({ agrees: false, modelHash: locked.modelHash }));
    const actions = (await auditOf('Revision', t.revisionId)).map((a) => a.action);
    expect(actions).toEqual(
      expect.arrayContaining(['independent_model.started', 'independent_model.locked', 'revision.signed_checked']),
    );
  });

  it('when a checker signs as checked without a locked model, then it is refused', async () => {
    const t = await modelTeam(app);
    expect((await sign(t.checker.session, t.revisionId, 'checked')).status).toBe(403);
    await saveModel(t.checker.session, t.revisionId, fixtureInput());
    expect((await sign(t.checker.session, t.revisionId, 'checked')).status).toBe(403);
  });
});

describe('independent model signing blocker (the rule on its own)', () => {
  const need = {
    method: 'independent-model' as const,
    reason: 'X asks for an independent model for every calc',
    tolerances: { inputs: 0.001, results: 0.02 },
  };
  const model = { checkerId: 7, checkerName: 'Tobias', locked: true, agrees: false, authorHash: 'a' };
  const base = { need, signerId: 7, model, authorHashNow: 'a', unclosedDifferences: 0 };
  it.each([
    ['no model yet', { model: null }, /Build and lock your independent model/],
    ["another checker's model", { signerId: 8 }, /Tobias built the independent model/],
    ['an open model', { model: { ...model, locked: false } }, /Lock your independent model first/],
    ['the author changed the calc since', { authorHashNow: 'b' }, /compare again/],
    ['differences with findings not closed', { unclosedDifferences: 2 }, /2 differences between the two models/],
  ])('when there is %s, then signing as checked is refused with the reason', (_what, change, message) => {
    expect(independentModelBlocker('checked', { ...base, ...change })).toMatch(message);
  });
  it('when the differences are closed or the models agree, or the meaning is not "checked", then it does not block', () => {
    expect(independentModelBlocker('checked', base)).toBeNull();
    expect(
      independentModelBlocker('checked', { ...base, model: { ...model, agrees: true }, unclosedDifferences: 3 }),
    ).toBeNull();
    expect(independentModelBlocker('approved', { ...base, model: null })).toBeNull();
    expect(
      independentModelBlocker('checked', { ...base, need: { ...need, method: 'review' }, model: null }),
    ).toBeNull();
  });
});

type Who = 'author' | 'owner' | 'other checker' | 'approver' | 'compliance' | 'admin';
// Per role: may they see the open model, change it, see the author's numbers before the lock, change the locked model.
const MATRIX: [Who, { readsOpen: boolean; writesOpen: boolean; blind: boolean }][] = [
  ['author', { readsOpen: false, writesOpen: false, blind: false }],
  ['owner', { readsOpen: true, writesOpen: true, blind: true }],
  ['other checker', { readsOpen: false, writesOpen: false, blind: true }],
  ['approver', { readsOpen: false, writesOpen: false, blind: false }],
  ['compliance', { readsOpen: false, writesOpen: false, blind: false }],
  ['admin', { readsOpen: false, writesOpen: false, blind: false }],
];

describe.each(MATRIX)('independent model integrity for %s', (who, expected) => {
  let t: Awaited<ReturnType<typeof modelTeam>>;
  let s: typeof t.checker.session;
  beforeAll(async () => {
    t = await modelTeam(app);
    await saveModel(t.checker.session, t.revisionId, fixtureInput());
    const roles = {
      author: null,
      owner: null,
      'other checker': ['checker'],
      approver: ['approver'],
      compliance: ['compliance'],
      admin: ['admin'],
    } as const;
    s =
      who === 'author'
        ? t.author.session
        : who === 'owner'
          ? t.checker.session
          : (await person(app, [...roles[who]!] as never)).session;
  });

  it(`when they read the checker's open model, then the API answers ${expected.readsOpen ? 200 : 403}`, async () => {
    expect((await s.get(modelUrl(t.revisionId))).status).toBe(expected.readsOpen ? 200 : 403);
  });

  it(`when they change the open model, then the API answers ${expected.writesOpen ? 200 : 403}`, async () => {
    const current = (await t.checker.session.get(modelUrl(t.revisionId))).body.lockVersion;
    const res = await s.put(modelUrl(t.revisionId), { input: fixtureInput(), lockVersion: current });
    expect(res.status).toBe(expected.writesOpen ? 200 : 403);
    if (!expected.writesOpen) expect(res.body.message.length).toBeGreaterThan(10);
  });

  it(`when they read the revision before the lock, then the author's numbers are ${expected.blind ? 'left out' : 'shown'}`, async () => {
    // Admins manage people and projects; they read no revisions at all.
    if (who === 'admin') return expect((await s.get(`/api/revisions/${t.revisionId}`)).status).toBe(403);
    const rev = await revisionOf(s, t.revisionId);
    expect(rev.result === null).toBe(expected.blind);
    expect(rev.verification.blind).toBe(expected.blind);
  });

  it('when the model is locked and they try to change or lock it again, then nobody can', async () => {
    const model = (await t.checker.session.get(modelUrl(t.revisionId))).body;
    if (model.state !== 'locked') await lockModel(t.checker.session, t.revisionId);
    const again = (await t.checker.session.get(modelUrl(t.revisionId))).body;
    const put = await s.put(modelUrl(t.revisionId), { input: fixtureInput(), lockVersion: again.lockVersion });
    const lock = await s.post(`${modelUrl(t.revisionId)}/lock`, { lockVersion: again.lockVersion });
    expect([put.status, lock.status]).toEqual(who === 'owner' ? [409, 409] : [403, 403]);
  });
});

describe('independent model: bad input and new revisions', () => {
  it('when the model input is not an object or the lock version is missing, then a 400 names the field', async () => {
    const t = await modelTeam(app);
    const res = await t.checker.session.put(modelUrl(t.revisionId), { input: 'sixty', lockVersion: 0 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors)).toContain('input');
    const noVersion = await t.checker.session.put(modelUrl(t.revisionId), { input: {} });
    expect(Object.keys(noVersion.body.fieldErrors)).toContain('lockVersion');
  });

  it('when the model has input errors, then it is kept but cannot be locked (400 naming the field)', async () => {
    const t = await modelTeam(app);
    const saved = await saveModel(t.checker.session, t.revisionId, { units: 'SI', segments: [] });
    expect(saved.inputIssues.length).toBeGreaterThan(0);
    const res = await t.checker.session.post(`${modelUrl(t.revisionId)}/lock`, { lockVersion: saved.lockVersion });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors).some((k) => k.startsWith('input'))).toBe(true);
  });

  it('when a stale lock version is sent, then 409 and nothing is overwritten', async () => {
    const t = await modelTeam(app);
    await saveModel(t.checker.session, t.revisionId, fixtureInput());
    const res = await t.checker.session.put(modelUrl(t.revisionId), { input: differentInput(), lockVersion: 0 });
    expect(res.status).toBe(409);
  });

  it('when a calc under a review-only standard is in check, then no model can be started (409) and nobody is blind', async () => {
    const { createCalc, advanceTo } = await import('../support/calc-harness');
    const author = await person(app, ['author']);
    const checker = await person(app, ['checker']);
    const approver = await person(app, ['approver']);
    const { revisionId } = await createCalc(author.session);
    await advanceTo(
      'in_check',
      { author: author.session, checker: checker.session, approver: approver.session },
      revisionId,
    );
    expect((await revisionOf(checker.session, revisionId)).verification).toEqual(
      expect.objectContaining({ blind: false, need: expect.objectContaining({ method: 'review' }) }),
    );
    expect((await checker.session.put(modelUrl(revisionId), { input: fixtureInput(), lockVersion: 0 })).status).toBe(
      409,
    );
  });
});

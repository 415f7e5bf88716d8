import { createCalc, fixtureInput, sign } from '../support/calc-harness';
import { expectStatus, person, type Session, startTestApp } from '../support/api-harness';
import { lockModel, modelTeam, modelUrl, revisionOf, saveModel } from '../support/model-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

// The author's calc carries numbers nobody would type by chance, so any answer that holds one of them leaked it.
const OD = [35.0173, 45.0271, 55.0313, 45.0419, 35.0523];
function authorInput(): Record<string, unknown> {
  const input = fixtureInput();
  input.title = 'Author title QX7 marker';
  (input.segments as { od: number }[]).forEach((s, i) => (s.od = OD[i]));
  (input.material as { Sy: number }).Sy = 531.0731;
  return input;
}

type Team = Awaited<ReturnType<typeof modelTeam>>;

/** Every number or text of the author's input, results and checklist that a blind reader must never receive. */
async function authorMarkers(t: Team): Promise<string[]> {
  const rev = await revisionOf(t.author.session, t.revisionId);
  const segments = rev.result.segments as { tauMax: number; yieldSafety: number }[];
  return [
    ...OD.map(String),
    '531.0731',
    'Author title QX7 marker',
    ...segments.flatMap((s) => [JSON.stringify(s.tauMax), JSON.stringify(s.yieldSafety)]),
    JSON.stringify(rev.result.twistTotal),
  ].filter((m) => m.length >= 6); // a 0 or a round figure could come from anywhere
}

/** Every read a checker can make about this calc, with its answer as text (binary bodies as latin1). */
async function everyRead(s: Session, t: Team): Promise<{ what: string; status: number; text: string }[]> {
  const calc = (await s.get(`/api/calcs/${t.calcId}`)).body as { number?: string };
  const urls = [
    `/api/revisions/${t.revisionId}`,
    `/api/calcs/${t.calcId}`,
    `/api/calcs?q=${encodeURIComponent(calc.number ?? '')}`,
    '/api/dashboard',
    '/api/dashboard/queues',
    `/api/revisions/${t.revisionId}/attachments`,
    `/api/calcs/${t.calcId}/diff?from=${t.revisionId}&to=${t.revisionId}`,
    `/api/revisions/${t.revisionId}/report.pdf`,
    `/api/calcs/${t.calcId}/evidence.zip`,
    modelUrl(t.revisionId),
    `/api/audit?calcId=${t.calcId}`,
  ];
  const answers = [];
  for (const url of urls) {
    const res = await s.get(url).buffer(true);
    const text = res.text ?? (Buffer.isBuffer(res.body) ? res.body.toString('latin1') : JSON.stringify(res.body));
    answers.push({ what: `GET ${url}`, status: res.status, text });
  }
  return answers;
}

const leaksIn = (answers: { what: string; text: string }[], markers: string[]) =>
  answers.flatMap((a) => markers.filter((m) => a.text.includes(m)).map((m) => `${a.what} holds ${m}`));

type Who = 'model owner' | 'other checker' | 'author' | 'approver' | 'compliance';
const BLIND: Who[] = ['model owner', 'other checker'];

describe.each<Who>(['model owner', 'other checker', 'author', 'approver', 'compliance'])(
  'the blind rule over every read, for the %s, before the model is locked',
  (who) => {
    let t: Team;
    let s: Session;
    let markers: string[];
    beforeAll(async () => {
      t = await modelTeam(app, authorInput());
      markers = await authorMarkers(t);
      // The owner's own model is the unchanged fixture: none of its numbers is one of the author's markers.
      await saveModel(t.checker.session, t.revisionId, fixtureInput());
      const roles = { 'other checker': 'checker', approver: 'approver', compliance: 'compliance' } as const;
      s =
        who === 'author'
          ? t.author.session
          : who === 'model owner'
            ? t.checker.session
            : (await person(app, [roles[who]])).session;
    });

    it(
      BLIND.includes(who) ? "then no answer holds any of the author's numbers" : "then they read the author's numbers",
      async () => {
        const answers = await everyRead(s, t);
        expect(answers.every((a) => a.status < 500)).toBe(true);
        const leaks = leaksIn(answers, markers);
        if (BLIND.includes(who)) expect(leaks).toEqual([]);
        else expect(leaks.length).toBeGreaterThan(0);
      },
    );

    it(`then the revision read ${BLIND.includes(who) ? 'leaves out' : 'holds'} the input, results, checklist and verdict`, async () => {
      const rev = await revisionOf(s, t.revisionId);
      const hidden = [rev.input, rev.result, rev.checklist, rev.verdict, rev.manualItems];
      if (BLIND.includes(who)) expect(hidden).toEqual([{}, null, null, null, {}]);
      else
        expect([Object.keys(rev.input).length > 0, rev.result !== null, rev.checklist !== null]).toEqual([
          true,
          true,
          true,
        ]);
    });
  },
);

describe('manual checklist items and the blind rule', () => {
  it('when a blind checker ticks a manual item, then 403 says to lock first, and nothing is stored; after the lock the tick is taken', async () => {
    const t = await modelTeam(app, authorInput());
    const markers = await authorMarkers(t);
    await saveModel(t.checker.session, t.revisionId, fixtureInput());
    const url = `/api/revisions/${t.revisionId}/manual-items/load-cases`;
    const refused = await t.checker.session.put(url, { done: true, note: '' });
    expect(refused.status).toBe(403);
    expect(refused.body.message).toMatch(/Lock your independent model first/);
    expect(leaksIn([{ what: 'tick', text: JSON.stringify(refused.body) }], markers)).toEqual([]);
    expect((await revisionOf(t.author.session, t.revisionId)).manualItems).toEqual({});

    await lockModel(t.checker.session, t.revisionId);
    const ticked = await t.checker.session.put(url, { done: true, note: '' });
    expect(ticked.status).toBe(200);
    expect(ticked.body.manualItems['load-cases']).toEqual(expect.objectContaining({ done: true }));
  });

  it("when the owner locks, then the lock answer and their reads hold the author's numbers (the comparison)", async () => {
    const t = await modelTeam(app, authorInput());
    const markers = await authorMarkers(t);
    await saveModel(t.checker.session, t.revisionId, fixtureInput());
    const locked = await lockModel(t.checker.session, t.revisionId);
    expect(locked.agrees).toBe(false);
    expect(leaksIn(await everyRead(t.checker.session, t), markers).length).toBeGreaterThan(0);
  });
});

/**
 * The verdict a checker's queue shows for one revision, through both ways a queue is read: all of a person's queues
 * together (the first page), then that queue alone (its later pages). Other files fill the shared queue meanwhile, so
 * the cursor is followed to the end.
 */
async function queuedVerdict(s: Session, revisionId: number): Promise<{ together: unknown; alone: unknown }> {
  type Page = { key: string; items: { revisionId: number; verdict: string | null }[]; next: string | null };
  const find = async (first: Page) => {
    for (let page = first; ;) {
      const item = page.items.find((i) => i.revisionId === revisionId);
      if (item) return item.verdict;
      if (!page.next) return 'not queued';
      const more = await s.get(`/api/dashboard/queues/awaiting-my-check?size=500&after=${page.next}`);
      page = expectStatus(more, 200, 'queue page').body;
    }
  };
  const all = expectStatus(await s.get('/api/dashboard/queues?size=500'), 200, 'queues').body as Page[];
  const alone = expectStatus(await s.get('/api/dashboard/queues/awaiting-my-check?size=500'), 200, 'queue').body;
  return { together: await find(all.find((p) => p.key === 'awaiting-my-check')!), alone: await find(alone) };
}

describe("the blind rule in the checkers' queue", () => {
  it("when a calc waits for an independent model, then every checker's queue lists it without its verdict until that checker's own model is locked", async () => {
    // The model's owner also authors, so their queues read their own drafts beside the checks (the blind facts are
    // read for the checks only); the other checker has the checks alone.
    const t = await modelTeam(app, authorInput(), ['author', 'checker']);
    const verdict = (await revisionOf(t.author.session, t.revisionId)).verdict;
    expect(verdict).toEqual(expect.any(String));
    const other = await person(app, ['checker']);
    await saveModel(t.checker.session, t.revisionId, fixtureInput());
    const hidden = { together: null, alone: null };
    expect(await queuedVerdict(t.checker.session, t.revisionId)).toEqual(hidden);
    expect(await queuedVerdict(other.session, t.revisionId)).toEqual(hidden);

    await lockModel(t.checker.session, t.revisionId);
    expect(await queuedVerdict(t.checker.session, t.revisionId)).toEqual({ together: verdict, alone: verdict });
    expect(await queuedVerdict(other.session, t.revisionId)).toEqual(hidden);
  });

  it('when the standard asks for no independent model, then the queue shows the verdict', async () => {
    const author = await person(app, ['author']);
    const checker = await person(app, ['checker']);
    const { revisionId } = await createCalc(author.session);
    expectStatus(await sign(author.session, revisionId, 'authored'), 200, 'submit');
    const verdict = (await revisionOf(author.session, revisionId)).verdict;
    expect(verdict).toEqual(expect.any(String));
    expect(await queuedVerdict(checker.session, revisionId)).toEqual({ together: verdict, alone: verdict });
  });
});

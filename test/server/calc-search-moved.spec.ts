import { randomBytes } from 'node:crypto';
import type { Transaction } from 'sequelize';
import { startTestApp } from '../support/api-harness';
import { calcTeam, fixtureInput, sign, tickAll } from '../support/calc-harness';
import { SEARCH_LIMITS } from '../../server/calcs/calc-search-plan';
import { RESTAMP, restampOnce, startSearchRestamp } from '../../server/calcs/search-restamp';
import { runTransaction } from '../../server/db/transaction';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Team = Awaited<ReturnType<typeof calcTeam>>;
type Page = { items: { id: number; number: string }[]; next: string | null };

/** A word no other spec's calc holds. */
const uniqueWord = () => `zm${BigInt(`0x${randomBytes(6).toString('hex')}`).toString(36)}`.slice(0, 10);

async function addCalc(t: Team, number: string, title: string): Promise<{ id: number; revisionId: number }> {
  const res = await t.author.session.post('/api/calcs', {
    projectId: t.project.id,
    number,
    title,
    partRef: 'DRG-2041-B',
    ruleSetId: t.calc.latest.ruleSet.id,
    input: fixtureInput(),
  });
  expect(res.status).toBe(201);
  return { id: res.body.id, revisionId: res.body.latest.id };
}

const search = async (t: Team, query: string): Promise<Page> => {
  const res = await t.author.session.get(`/api/calcs?${query}`);
  expect({ query, status: res.status }).toEqual({ query, status: 200 });
  return res.body;
};

async function allIds(t: Team, query: string): Promise<number[]> {
  const pages = [await search(t, query)];
  while (pages[pages.length - 1].next) pages.push(await search(t, `${query}&after=${pages[pages.length - 1].next}`));
  return pages.flatMap((p) => p.items.map((r) => r.id));
}

/** Moves a calc's last change as a save does (only the time). */
const setLastChange = (id: number, at: string, transaction?: Transaction) =>
  sequelize.query('UPDATE calcs SET latest_updated_at = ? WHERE id = ?', {
    replacements: [new Date(at), id],
    transaction,
  });

/** Where a calc's last change is held for the search: its moved row's, and its term rows' (distinct). */
async function heldTimes(id: number): Promise<{ moved: string | null; terms: string[] }> {
  const [moved] = (await sequelize.query(
    'SELECT DATE_FORMAT(latest_updated_at, "%H:%i:%s.%f") AS at FROM calc_search_moved WHERE calc_id = ?',
    { replacements: [id] },
  )) as [{ at: string }[], unknown];
  const [terms] = (await sequelize.query(
    'SELECT DISTINCT DATE_FORMAT(latest_updated_at, "%H:%i:%s.%f") AS at FROM calc_search_terms WHERE calc_id = ?',
    { replacements: [id] },
  )) as [{ at: string }[], unknown];
  return { moved: moved[0]?.at ?? null, terms: terms.map((r) => r.at) };
}

describe('a search by last change takes saved calcs at their true time', () => {
  it('when some calcs were saved since their search terms were written and others not, then every page of a search by last change lists what the plain list lists', async () => {
    // Arrange: eleven calcs with the word, five with a second word too, one submitted, one checked; every last change
    // moved as a save moves it, folded into the terms, then six moved again (some ahead of the others, some behind
    // what their terms still hold), two pairs at the same millisecond; ids not in time order
    const t = await calcTeam(app);
    const [w, v] = [uniqueWord(), uniqueWord()];
    const both = [1, 4, 5, 8, 9];
    const calcs: { id: number; revisionId: number }[] = [];
    for (let i = 0; i < 11; i++) calcs.push(await addCalc(t, `M-${i}`, both.includes(i) ? `${w} ${v}` : w));
    for (const i of [4, 7]) expect((await sign(t.author.session, calcs[i].revisionId, 'authored')).status).toBe(200);
    // Checked sorts after in check in the workflow, before draft by name.
    await tickAll(t.checker.session, calcs[7].revisionId);
    expect((await sign(t.checker.session, calcs[7].revisionId, 'checked')).status).toBe(200);
    for (const [i, c] of calcs.entries()) await setLastChange(c.id, `2026-11-30T08:${String(10 + i * 3)}:00.000Z`);
    while ((await restampOnce(sequelize, 0)) > 0);
    const again: [number, string][] = [
      [0, '2026-11-30T09:00:00.000Z'],
      [3, '2026-11-30T08:20:00.000Z'],
      [5, '2026-11-30T08:05:00.000Z'],
      [6, '2026-11-30T08:28:00.000Z'],
      [9, '2026-11-30T09:00:00.000Z'],
      [10, '2026-11-30T08:28:00.000Z'],
    ];
    for (const [i, at] of again) await setLastChange(calcs[i].id, at);
    expect((await heldTimes(calcs[0].id)).moved).toBe('09:00:00.000000');
    expect((await heldTimes(calcs[1].id)).moved).toBeNull();
    const mine = new Set(calcs.map((c) => c.id));
    const withBoth = new Set(both.map((i) => calcs[i].id));

    const saved = { ...SEARCH_LIMITS };
    try {
      for (const firstChunk of [1, 200]) {
        Object.assign(SEARCH_LIMITS, { firstChunk });
        for (const order of [
          'sort=updatedAt&dir=desc',
          'sort=updatedAt&dir=asc',
          'sort=status&dir=asc',
          'sort=status&dir=desc',
        ]) {
          for (const [q, filter, twoWords] of [
            [w, '', false],
            [w, '&status=draft', false],
            [`${w}%20${v}`, '', true],
            [w, `&projectId=${t.project.id}`, false],
          ] as const) {
            // Act: pages of one and of three
            const state = filter.includes('status') ? filter : '';
            const plain = await allIds(t, `projectId=${t.project.id}${state}&size=50&${order}`);
            const wanted = plain.filter((id) => mine.has(id) && (!twoWords || withBoth.has(id)));
            for (const size of [1, 3]) {
              const found = await allIds(t, `q=${q}${filter}&size=${size}&${order}`);

              // Assert
              expect({ order, q, filter, size, firstChunk, found }).toEqual({
                order,
                q,
                filter,
                size,
                firstChunk,
                found: wanted,
              });
            }
          }
        }
      }
    } finally {
      Object.assign(SEARCH_LIMITS, saved);
    }
  });

  it("when a save moves only a calc's last change, then its moved row holds it and its terms are left alone, until the change is folded back or the terms are written anyway", async () => {
    // Arrange
    const t = await calcTeam(app);
    const { id, revisionId } = await addCalc(t, 'M-T', `${uniqueWord()} spindle`);
    await setLastChange(id, '2026-11-30T10:05:00.000Z');
    while ((await restampOnce(sequelize, 0)) > 0);
    expect(await heldTimes(id)).toEqual({ moved: null, terms: ['10:05:00.000000'] });

    // Act, Assert: a save keeps the change in the moved row
    await setLastChange(id, '2026-11-30T10:59:59.999Z');
    expect(await heldTimes(id)).toEqual({ moved: '10:59:59.999000', terms: ['10:05:00.000000'] });

    // A recent change is not folded back; one older than the quiet time is.
    const now = new Date().toISOString();
    await setLastChange(id, now);
    await restampOnce(sequelize, 300);
    expect((await heldTimes(id)).moved).toBe(now.slice(11, 23) + '000');
    await setLastChange(id, '2026-11-30T11:00:00.000Z');
    while ((await restampOnce(sequelize, 300)) > 0);
    expect(await heldTimes(id)).toEqual({ moved: null, terms: ['11:00:00.000000'] });

    // A new state writes the terms with the submission's time and ends the moved row.
    await setLastChange(id, '2026-11-30T12:00:00.000Z');
    expect((await sign(t.author.session, revisionId, 'authored')).status).toBe(200);
    const [[calc]] = (await sequelize.query(
      'SELECT DATE_FORMAT(latest_updated_at, "%H:%i:%s.%f") AS at, latest_status AS s FROM calcs WHERE id = ?',
      { replacements: [id] },
    )) as [{ at: string; s: string }[], unknown];
    expect(calc.s).toBe('in_check');
    expect(await heldTimes(id)).toEqual({ moved: null, terms: [calc.at] });
  });

  it("when saves and the folding run at the same moments, then each calc's last change is still held by its moved row or by all its terms", async () => {
    // Arrange: three calcs, each saved thirty times while batches fold every quiet row back at once
    const t = await calcTeam(app);
    const calcs = [];
    for (const n of [1, 2, 3]) calcs.push(await addCalc(t, `M-R${n}`, `${uniqueWord()} coupling`));

    // Act
    for (let i = 0; i < 30; i++) {
      const at = `2026-11-30T09:${String(10 + i).padStart(2, '0')}:00.000Z`;
      // Each change in a transaction retried as the app's saves are: on a loaded machine the database may pick the
      // upsert of a moved row as the victim of a deadlock with a fold deleting it, which a save runs again.
      await Promise.all([
        restampOnce(sequelize, 0),
        ...calcs.map((c) => runTransaction(sequelize, (transaction) => setLastChange(c.id, at, transaction))),
        restampOnce(sequelize, 0),
      ]);
    }

    // Assert
    for (const c of calcs) {
      const held = await heldTimes(c.id);
      const truth = '09:39:00.000000';
      expect(held.moved === truth || (held.moved === null && held.terms.join() === truth)).toBe(true);
      expect(held.moved === null || held.moved === truth).toBe(true);
    }
  });

  it('when the folding runs in an instance, then a quiet moved row is folded back by one of its rounds', async () => {
    // Arrange: a calc saved long ago, its change still in a moved row; rounds every 20 ms
    const t = await calcTeam(app);
    const { id } = await addCalc(t, 'M-L', `${uniqueWord()} keyway`);
    await setLastChange(id, '2026-11-30T07:00:00.000Z');
    expect((await heldTimes(id)).moved).toBe('07:00:00.000000');
    const saved = { ...RESTAMP };
    Object.assign(RESTAMP, { pollSeconds: 0.02 });
    const folding = startSearchRestamp(sequelize);
    try {
      // Act: wait for the fold (a bound on the wait, not on its speed)
      for (let i = 0; i < 500 && (await heldTimes(id)).moved !== null; i++) await new Promise((r) => setTimeout(r, 20));
    } finally {
      await folding.stop();
      Object.assign(RESTAMP, saved);
    }

    // Assert
    expect(await heldTimes(id)).toEqual({ moved: null, terms: ['07:00:00.000000'] });
  });
});

import { randomBytes } from 'node:crypto';
import { startTestApp } from '../support/api-harness';
import { calcTeam, fixtureInput, sign } from '../support/calc-harness';
import { SEARCH_LIMITS, chooseDriver } from '../../server/calcs/calc-search-plan';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Team = Awaited<ReturnType<typeof calcTeam>>;
type Page = {
  items: { id: number; number: string }[];
  next: string | null;
  total: number | null;
  totalIsAtLeast: boolean;
  stoppedEarly: boolean;
};

/** A word no other spec's calc holds, so searches across the whole library see only this test's calcs. */
const uniqueWord = () => `zq${BigInt(`0x${randomBytes(6).toString('hex')}`).toString(36)}`.slice(0, 10);

async function addCalc(t: Team, number: string, title: string): Promise<number> {
  const res = await t.author.session.post('/api/calcs', {
    projectId: t.project.id,
    number,
    title,
    partRef: 'DRG-2040-A',
    ruleSetId: t.calc.latest.ruleSet.id,
    input: fixtureInput(),
  });
  expect(res.status).toBe(201);
  return res.body.id;
}

/** Calcs of the team's project, by number and title, made in the order given. */
async function addCalcs(t: Team, rows: [number: string, title: string][]): Promise<void> {
  for (const [number, title] of rows) await addCalc(t, number, title);
}

const search = async (t: Team, query: string): Promise<Page> => {
  const res = await t.author.session.get(`/api/calcs?${query}`);
  expect(res.status).toBe(200);
  return res.body;
};

/** Every page of a search, following `next` to the end. */
async function allPages(t: Team, query: string): Promise<Page[]> {
  const pages = [await search(t, query)];
  while (pages[pages.length - 1].next) pages.push(await search(t, `${query}&after=${pages[pages.length - 1].next}`));
  return pages;
}

/** What `act` returned, with the statements the app sent meanwhile (as Sequelize's logging sees them). */
async function sentDuring<T>(act: () => Promise<T>): Promise<{ sent: string[]; result: T }> {
  const sent: string[] = [];
  const options = (sequelize as unknown as { options: { logging: unknown } }).options;
  const before = options.logging;
  options.logging = (sql: string) => sent.push(sql.replace(/^Executing \([^)]*\): /, ''));
  try {
    return { result: await act(), sent };
  } finally {
    options.logging = before;
  }
}

describe('the search box finds calcs by the starts of their words', () => {
  it('when every typed word starts a word of the calc, then it is found, and only then', async () => {
    // Arrange
    const t = await calcTeam(app);
    const w = uniqueWord();
    const gearbox = await addCalc(t, 'S-1', `${w} Gearbox input shaft`);
    const pump = await addCalc(t, 'S-2', `${w} Pump impeller shaft`);
    const fan = await addCalc(t, 'S-3', `${w} Fan countershaft`);
    const ids = async (q: string) =>
      (await search(t, `q=${encodeURIComponent(q)}&sort=number&dir=asc`)).items.map((r) => r.id);

    // Act and Assert: across the whole library, and within the project
    expect(await ids(`${w} shaf`)).toEqual([gearbox, pump]);
    expect(await ids(`${w} COUNTER`)).toEqual([fan]);
    expect(await ids(`${w} gearbox impeller`)).toEqual([]);
    expect(await ids(`"${w}" +pump* -impeller`)).toEqual([pump]);
    // One letter: every calc of the project with a word starting with s (the team's first is a shaft too).
    const inProject = await search(t, `projectId=${t.project.id}&q=S-&sort=number&dir=asc`);
    expect(inProject.items.map((r) => r.id)).toEqual([t.calc.id, gearbox, pump, fan]);
  });

  it('when letters carry accents or capitals, then either spelling finds the calc', async () => {
    const t = await calcTeam(app);
    const w = uniqueWord();
    const id = await addCalc(t, 'A-1', `${w} Ölpumpe Welle`);
    expect((await search(t, `q=${w}%20olpu`)).items.map((r) => r.id)).toEqual([id]);
    expect((await search(t, `q=${w.toUpperCase()}%20WEL`)).items.map((r) => r.id)).toEqual([id]);
  });

  it('when a calc changes state, or its project or author is renamed, then the next search sees it', async () => {
    // Arrange
    const t = await calcTeam(app);
    const w = uniqueWord();
    const found = async (q: string) => (await search(t, `q=${w}%20${encodeURIComponent(q)}`)).items.map((r) => r.id);
    await sequelize.query('UPDATE calcs SET title = ? WHERE id = ?', { replacements: [`${w} shaft`, t.calc.id] });
    expect(await found('draft')).toEqual([t.calc.id]);

    // Act
    expect((await sign(t.author.session, t.revisionId, 'authored')).status).toBe(200);
    await sequelize.query('UPDATE projects SET code = ? WHERE id = ?', { replacements: [`P${w}`, t.project.id] });
    await sequelize.query('UPDATE users SET display_name = ? WHERE id = ?', {
      replacements: [`Orla Q${w}`, t.calc.latest.author.id],
    });

    // Assert
    expect(await found('draft')).toEqual([]);
    expect(await found('in check')).toEqual([t.calc.id]);
    expect(await found(`p${w}`)).toEqual([t.calc.id]);
    expect(await found(`q${w}`)).toEqual([t.calc.id]);
  });
});

/** Every list order, each in one direction. */
const ORDERS = ['sort=number&dir=asc', 'sort=title&dir=desc', 'sort=updatedAt&dir=desc', 'sort=status&dir=asc'];

describe('search pages', () => {
  it('when a search is read page by page in each order, then it lists what the plain list lists, in the same order', async () => {
    // Arrange: five calcs, three with the word
    const t = await calcTeam(app);
    const w = uniqueWord();
    await addCalcs(t, [
      ['P-5', `${w} idler`],
      ['P-1', 'plain drum'],
      ['P-3', `${w} drum`],
      ['P-2', `${w} hoist`],
    ]);

    for (const order of ORDERS) {
      // Act
      const plain = (await search(t, `projectId=${t.project.id}&size=50&${order}`)).items;
      const pages = await allPages(t, `projectId=${t.project.id}&q=${w}&size=2&${order}`);

      // Assert
      const wanted = plain.filter((r) => ['P-5', 'P-3', 'P-2'].includes(r.number)).map((r) => r.id);
      expect(pages.flatMap((p) => p.items.map((r) => r.id))).toEqual(wanted);
      expect(pages.map((p) => p.total)).toEqual([3, null]);
    }
  });

  it('when one word alone is searched across the library, then its pages list what the plain list lists, counted up to the cap', async () => {
    // Arrange: four calcs with the word and one without, in a project of their own
    const t = await calcTeam(app);
    const w = uniqueWord();
    await addCalcs(t, [
      ['E-4', `${w} idler`],
      ['E-1', 'plain drum'],
      ['E-3', `${w} drum`],
      ['E-2', `${w} hoist`],
      ['E-5', `${w} winch`],
    ]);
    const withWord = ['E-4', 'E-3', 'E-2', 'E-5'];

    for (const order of [
      'sort=number&dir=asc',
      'sort=title&dir=desc',
      'sort=updatedAt&dir=asc',
      'sort=status&dir=desc',
    ]) {
      // Act: the word alone (one statement a page), and with a state the word's index holds
      const plain = (await search(t, `projectId=${t.project.id}&size=50&${order}`)).items;
      const pages = await allPages(t, `q=${w}&size=3&${order}`);
      const drafts = await allPages(t, `q=${w}&status=draft&size=3&${order}`);

      // Assert
      const wanted = plain.filter((r) => withWord.includes(r.number)).map((r) => r.id);
      for (const found of [pages, drafts]) {
        expect(found.flatMap((p) => p.items.map((r) => r.id))).toEqual(wanted);
        expect(found.map((p) => [p.total, p.totalIsAtLeast])).toEqual([
          [4, false],
          [null, false],
        ]);
      }
    }
    const approved = await search(t, `q=${w}&status=approved&sort=updatedAt`);
    expect([approved.items, approved.total, approved.next]).toEqual([[], 0, null]);

    // The count stops one past the cap and says "at least".
    const saved = { ...SEARCH_LIMITS };
    try {
      Object.assign(SEARCH_LIMITS, { countCap: 3 });
      const capped = await search(t, `q=${w}&size=2`);
      expect([capped.items.length, capped.total, capped.totalIsAtLeast]).toEqual([2, 3, true]);
      Object.assign(SEARCH_LIMITS, { countCap: 4 });
      const exact = await search(t, `q=${w}&size=2`);
      expect([exact.total, exact.totalIsAtLeast]).toEqual([4, false]);
    } finally {
      Object.assign(SEARCH_LIMITS, saved);
    }
  });

  it('when a search reads its candidates in several chunks, then each chunk starts after the last one read, matching or not', async () => {
    // Arrange: the first word in ten calcs, the second in ten, both in three; a page of one reads 8, then 32.
    const t = await calcTeam(app);
    const [a, b] = [uniqueWord(), uniqueWord()];
    for (let i = 0; i < 10; i++) await addCalc(t, `W-${i}`, [1, 5, 8].includes(i) ? `${a} ${b} shaft` : `${a} shaft`);
    for (let i = 0; i < 7; i++) await addCalc(t, `V-${i}`, `${b} shaft`);

    const saved = { ...SEARCH_LIMITS };
    Object.assign(SEARCH_LIMITS, { firstChunk: 1 });
    try {
      for (const order of [
        'sort=number&dir=desc',
        'sort=title&dir=asc',
        'sort=updatedAt&dir=desc',
        'sort=status&dir=asc',
      ]) {
        // Act
        const plain = (await search(t, `projectId=${t.project.id}&size=50&${order}`)).items;
        const pages = await allPages(t, `q=${a}%20${b}&size=1&${order}`);

        // Assert
        const wanted = plain.filter((r) => ['W-1', 'W-5', 'W-8'].includes(r.number)).map((r) => r.id);
        expect(pages.flatMap((p) => p.items.map((r) => r.id))).toEqual(wanted);
      }
    } finally {
      Object.assign(SEARCH_LIMITS, saved);
    }
  });

  it('when two words are searched within a state, a project or both, then only calcs with both words that pass the filter are listed, in every order', async () => {
    // Arrange: both words in a draft and a calc in check of one project and in a calc in check of another; each word
    // alone in a calc in check. The state index serves the state filter for two orders, the term index for the rest.
    const [t, other] = [await calcTeam(app), await calcTeam(app)];
    const [a, b] = [uniqueWord(), uniqueWord()];
    const inCheck = async (team: Team, number: string, title: string) => {
      const id = await addCalc(team, number, title);
      const calc = (await team.author.session.get(`/api/calcs/${id}`)).body;
      expect((await sign(team.author.session, calc.latest.id, 'authored')).status).toBe(200);
      return id;
    };
    const both = await addCalc(t, 'T-1', `${a} ${b} shaft`);
    const bothInCheck = await inCheck(t, 'T-2', `${a} ${b} shaft`);
    await inCheck(t, 'T-3', `${a} shaft`);
    await inCheck(t, 'T-4', `${b} shaft`);
    const elsewhere = await inCheck(other, 'O-1', `${a} ${b} shaft`);
    const cases = [
      ['status=in_check', [bothInCheck, elsewhere]],
      [`projectId=${t.project.id}`, [both, bothInCheck]],
      [`projectId=${t.project.id}&status=in_check`, [bothInCheck]],
    ] as const;

    const saved = { ...SEARCH_LIMITS };
    Object.assign(SEARCH_LIMITS, { firstChunk: 1 });
    try {
      for (const [filter, wanted] of cases)
        for (const order of [
          'sort=number&dir=asc',
          'sort=updatedAt&dir=desc',
          'sort=status&dir=asc',
          'sort=title&dir=desc',
        ]) {
          // Act
          const pages = await allPages(t, `q=${a}%20${b}&${filter}&size=1&${order}`);

          // Assert
          const ids = pages.flatMap((p) => p.items.map((r) => r.id));
          expect({ filter, order, ids: [...ids].sort() }).toEqual({ filter, order, ids: [...wanted].sort() });
        }
    } finally {
      Object.assign(SEARCH_LIMITS, saved);
    }
  });

  it('when the page bound is reached before a page fills, then the answer says so and the next page searches on', async () => {
    // Arrange: two words, each in four calcs, together only in the oldest
    const t = await calcTeam(app);
    const [a, b] = [uniqueWord(), uniqueWord()];
    const both = await addCalc(t, 'B-0', `${a} ${b}`);
    for (const n of [1, 2, 3]) await addCalc(t, `B-${n}`, `${a} only`);
    for (const n of [4, 5, 6]) await addCalc(t, `B-${n}`, `${b} only`);
    const saved = { ...SEARCH_LIMITS };
    Object.assign(SEARCH_LIMITS, { pageBudget: 2, firstChunk: 1 });
    try {
      // Act
      const pages = await allPages(t, `q=${a}%20${b}&sort=updatedAt&dir=desc`);

      // Assert
      expect(pages[0]).toMatchObject({ items: [], stoppedEarly: true, totalIsAtLeast: true });
      expect(pages[0].next).toEqual(expect.any(String));
      expect(pages.flatMap((p) => p.items.map((r) => r.id))).toEqual([both]);
      expect(pages[pages.length - 1]).toMatchObject({ next: null, stoppedEarly: false });
    } finally {
      Object.assign(SEARCH_LIMITS, saved);
    }
  });
});

describe('a page read in one statement', () => {
  it('when a streamed page is cut short by the rows it may examine, then the page is walked in chunks and lists the same calcs', async () => {
    // Arrange: the first word in twelve calcs, the second in ten, both in four; pages of one, so that every walk is
    // longer than a first chunk would read whole (on the library's 100,000 calcs a walk is hundreds of candidates).
    const t = await calcTeam(app);
    const [a, b] = [uniqueWord(), uniqueWord()];
    for (let i = 0; i < 12; i++) await addCalc(t, `R-${i}`, i % 3 === 0 ? `${a} ${b} shaft` : `${a} shaft`);
    for (let i = 0; i < 6; i++) await addCalc(t, `Q-${i}`, `${b} shaft`);
    const saved = { ...SEARCH_LIMITS };
    Object.assign(SEARCH_LIMITS, { firstChunk: 1 });
    const ids = (pages: Page[]) => pages.flatMap((p) => p.items.map((r) => r.id));
    const streams = (sql: string) => /ROWS EXAMINED/.test(sql);
    const chunks = (sql: string) => /ROW_NUMBER\(\)/.test(sql);
    try {
      for (const order of [
        'sort=number&dir=asc',
        'sort=title&dir=desc',
        'sort=updatedAt&dir=desc',
        'sort=status&dir=asc',
      ]) {
        // Act: whole, then cut short after about two candidates
        const plain = (await search(t, `projectId=${t.project.id}&size=50&${order}`)).items;
        const whole = await sentDuring(() => allPages(t, `q=${a}%20${b}&size=1&${order}`));
        Object.assign(SEARCH_LIMITS, { streamed: 2 });
        const cut = await sentDuring(() => allPages(t, `q=${a}%20${b}&size=1&${order}`));
        Object.assign(SEARCH_LIMITS, { streamed: saved.streamed });

        // Assert
        const wanted = plain.filter((r) => ['R-0', 'R-3', 'R-6', 'R-9'].includes(r.number)).map((r) => r.id);
        expect({ order, ids: ids(whole.result) }).toEqual({ order, ids: wanted });
        expect({ order, ids: ids(cut.result) }).toEqual({ order, ids: wanted });
        expect(whole.sent.filter(streams).length).toBe(whole.result.length);
        expect(whole.sent.filter(chunks)).toEqual([]);
        expect(cut.sent.filter(streams).length).toBe(cut.result.length);
        expect(cut.sent.filter(chunks).length).toBeGreaterThan(0);
      }
    } finally {
      Object.assign(SEARCH_LIMITS, saved);
    }
  });
});

describe('where a search starts', () => {
  it("when two words are searched, then the walk starts from the rarer word's index, by the index's own estimate", async () => {
    // Arrange: the first word in twelve calcs, the second in three of them.
    const t = await calcTeam(app);
    const [broad, rare] = [uniqueWord(), uniqueWord()];
    for (let i = 0; i < 12; i++) await addCalc(t, `E-${i}`, i < 3 ? `${broad} ${rare} shaft` : `${broad} shaft`);

    for (const words of [
      [broad, rare],
      [rare, broad],
    ]) {
      // Act
      const driver = await chooseDriver(sequelize, words, {}, 'updatedAt');
      const withProject = await chooseDriver(sequelize, words, { projectId: t.project.id }, 'number');

      // Assert
      expect(driver.term?.word).toBe(rare);
      expect(withProject.term?.word).toBe(rare);
    }
    // A project with fewer calcs than either word starts from the project's own list.
    const small = await calcTeam(app);
    const fromProject = await chooseDriver(
      sequelize,
      [broad, broad.slice(0, 4)],
      { projectId: small.project.id },
      'title',
    );
    expect(fromProject.term).toBeUndefined();
    expect((await search(t, `q=${rare}%20${broad}&size=50`)).items).toHaveLength(3);
  });

  it('when the ranges of a search were estimated within the minute, then it sends no EXPLAIN, and a stale estimate changes no answer', async () => {
    // Arrange: the first word in eight calcs, the second in three of them; a search estimates both.
    const t = await calcTeam(app);
    const [a, b] = [uniqueWord(), uniqueWord()];
    for (let i = 0; i < 8; i++) await addCalc(t, `G-${i}`, i < 3 ? `${a} ${b} shaft` : `${a} shaft`);
    const statements = async (query: string) => {
      const { sent, result } = await sentDuring(() => search(t, query));
      return { sent, page: result };
    };
    const first = await statements(`q=${a}%20${b}&size=50`);
    // The second word becomes the broader, which the kept estimates do not know yet.
    for (let i = 0; i < 12; i++) await addCalc(t, `H-${i}`, i < 2 ? `${a} ${b} shaft` : `${b} shaft`);

    // Act
    const again = await statements(`q=${a}%20${b}&size=50`);

    // Assert
    expect(first.sent.filter((sql) => /^\s*EXPLAIN/i.test(sql))).toHaveLength(1);
    expect(first.page.items).toHaveLength(3);
    expect(again.sent.filter((sql) => /^\s*EXPLAIN/i.test(sql))).toHaveLength(0);
    expect(again.page.items.map((r) => r.number).sort()).toEqual(['G-0', 'G-1', 'G-2', 'H-0', 'H-1']);
    expect(again.page).toMatchObject({ total: 5, totalIsAtLeast: false, next: null });
  });

  it('when a walk is chosen, then the share of its candidates expected to match is a fraction, whatever the filters', async () => {
    // Arrange: the share sizes the first read (fewer candidates when most match): never negative, NaN or above 1.
    const t = await calcTeam(app);
    const [a, b] = [uniqueWord(), uniqueWord()];
    for (let i = 0; i < 4; i++) await addCalc(t, `F-${i}`, i < 2 ? `${a} ${b} shaft` : `${a} shaft`);
    const filters = [
      {},
      { projectId: t.project.id },
      { status: 'draft' as const },
      { projectId: t.project.id, status: 'draft' as const },
    ];

    for (const filter of filters)
      for (const sort of ['updatedAt', 'status', 'number', 'title'] as const)
        for (const words of [[a, b], ['shaft', a], [a], [uniqueWord(), a]]) {
          // Act
          const driver = await chooseDriver(sequelize, words, filter, sort);

          // Assert: estimated wherever there was a choice to make.
          const share = driver.share ?? 1;
          expect({ filter, sort, words, finite: Number.isFinite(share), share: share >= 0 && share <= 1 }).toEqual({
            filter,
            sort,
            words,
            finite: true,
            share: true,
          });
          if (words.length > 1 || filter.projectId) expect(driver.share).toEqual(expect.any(Number));
        }
  });

  it('when one of the words is in no calc, then the answer is empty and counted as none', async () => {
    const t = await calcTeam(app);
    const w = uniqueWord();
    await addCalc(t, 'N-1', `${w} shaft`);
    for (const q of [`${w} ${uniqueWord()}`, `${uniqueWord()} ${w}`, `shaft ${uniqueWord()}`]) {
      const page = await search(t, `q=${encodeURIComponent(q)}&size=50`);
      expect(page).toMatchObject({ items: [], total: 0, totalIsAtLeast: false, next: null, stoppedEarly: false });
      const inProject = await search(t, `q=${encodeURIComponent(q)}&projectId=${t.project.id}&size=50`);
      expect(inProject).toMatchObject({ items: [], total: 0, totalIsAtLeast: false, next: null });
    }
  });
});

describe('hostile search input', () => {
  it.each([
    ['nothing', '', 200],
    ['spaces', '    ', 200],
    ['one letter', 'c', 200],
    ['two letters', 'C-', 200],
    ['SQL', "'; DROP TABLE calcs; --", 200],
    ['a word far past the index', 'countershaftcountershaftcountershaft', 200],
  ])('when the search box holds %s, then the answer is a list', async (_what, q, status) => {
    const t = await calcTeam(app);
    const res = await t.author.session.get(`/api/calcs?projectId=${t.project.id}&q=${encodeURIComponent(q)}`);
    expect(res.status).toBe(status);
    expect(Array.isArray(res.body.items)).toBe(true);
  });

  it.each([
    ['the plain list', ''],
    ['a search by last change', '&q=shaft'],
    ['a search by state', '&q=shaft&sort=status'],
  ])(
    'when %s is asked for the page after a time that is no date, then it is a 400 naming the cursor',
    async (_w, q) => {
      const t = await calcTeam(app);
      const status = q.includes('status') ? ['draft'] : [];
      for (const at of ['9999-99-99', '2026-02-30T25:00:00.000Z', 'yesterday']) {
        const after = Buffer.from(JSON.stringify([...status, at, 1])).toString('base64url');
        const res = await t.author.session.get(`/api/calcs?projectId=${t.project.id}${q}&after=${after}`);
        expect([at, res.status, res.body.fieldErrors]).toEqual([
          at,
          400,
          { after: ['is not a page cursor of this list; start from the first page'] },
        ]);
      }
    },
  );

  it.each([
    ['signs only', '+*', 'needs a letter or digit to search for'],
    ['quotes and wildcards only', '"%_*"', 'needs a letter or digit to search for'],
    ['10,000 characters', 'x'.repeat(10_000), 'must be at most 100 characters'],
    ['nine words', 'a1 b2 c3 d4 e5 f6 g7 h8 i9', 'may hold at most 8 words'],
  ])('when the search box holds %s, then it is a 400 naming the search', async (_what, q, message) => {
    const t = await calcTeam(app);
    const res = await t.author.session.get(`/api/calcs?q=${encodeURIComponent(q)}`);
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({ 'query.q': [message] });
    expect(res.body.message).toBe(`Invalid input — Search: ${message}`);
  });
});

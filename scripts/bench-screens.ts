// Screen benchmark: how long each main screen takes from navigation to usable, in Debian's headless
// Chromium against the demo database, with the API calls behind it (count, slowest by Server-Timing)
// and the script fetched. Prints figures only; tests never depend on them. Needs the built client.
import type { Page } from 'playwright-core';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { Calc, Project } from '../server/db/models';
import { waterfall } from './bench-screens-trace';
import { runInBrowser, signedInPage } from './bench-browser';

const RUNS = Number(process.env.BENCH_SCREEN_RUNS ?? 3);
/** BENCH_SCREENS="editor,calc page" measures only the named screens (all by default). */
const ONLY = process.env.BENCH_SCREENS?.split(',').map((s) => s.trim());
/** BENCH_SCREEN_TRACE=1 prints each screen's first-visit timeline (scripts, API calls, server phases). */
const TRACE = process.env.BENCH_SCREEN_TRACE === '1';

/*
 * "Usable" is measured, per screen, as: its main content and (where it has one) the verdict are on screen, and it
 * accepts input (the editor's fields are there, enabled when the reader may edit; the calc page's next step is
 * there). Each `ready` waits for all of those, not for the first sign of life.
 */
interface Screen {
  name: string;
  user: string;
  url: string;
  ready: (page: Page) => Promise<unknown>;
}

const all = (...waits: Promise<unknown>[]) => Promise.all(waits);

async function screens(): Promise<Screen[]> {
  const sequelize = createSequelize(loadConfig());
  const calc = await Calc.findOne({ where: { number: 'CV1200-SH-001' } });
  const project = await Project.findOne({ where: { code: 'KFD-CV1200' } });
  await sequelize.close();
  if (!calc || !project) throw new Error('the demo data is not loaded (npm run seed)');
  const latest = await calcLatest(calc.id);
  return [
    {
      name: 'overview',
      user: 'checker',
      url: '/',
      ready: (p) =>
        all(
          p.getByRole('heading', { name: /Good to see you/ }).waitFor(),
          p.locator('section.waiting h3.queue-title').first().waitFor(),
        ),
    },
    {
      name: 'projects',
      user: 'author',
      url: '/projects',
      ready: (p) =>
        p
          .getByRole('link', { name: /KFD-CV1200/ })
          .first()
          .waitFor(),
    },
    {
      name: 'project calcs',
      user: 'author',
      url: `/projects/${project.id}`,
      ready: (p) => p.getByText('CV1200-SH-001').first().waitFor(),
    },
    {
      name: 'calc page',
      user: 'checker',
      url: `/calcs/${calc.id}`,
      ready: (p) =>
        all(
          p.locator('section.main .status tt-verdict-badge').waitFor(),
          p.locator('tt-checklist-table tr[mat-row]').first().waitFor(),
          p.locator('section.main .status p.next').waitFor(),
        ),
    },
    {
      name: 'editor',
      user: 'author',
      url: `/revisions/${latest}/edit`,
      ready: (p) =>
        all(
          p.locator('tt-verdict-strip [data-verdict]').waitFor(),
          p.locator('[data-path="segments[0].od"]').waitFor(),
        ),
    },
    {
      name: 'audit trail',
      user: 'compliance',
      url: '/audit',
      ready: (p) => p.locator('table tbody tr').first().waitFor(),
    },
    {
      name: 'standards',
      user: 'compliance',
      url: '/rule-sets',
      ready: (p) =>
        p
          .getByText(/KFD-ENG-014/)
          .first()
          .waitFor(),
    },
  ];
}

async function calcLatest(calcId: number): Promise<number> {
  const sequelize = createSequelize(loadConfig());
  const [rows] = await sequelize.query('SELECT MAX(id) AS id FROM revisions WHERE calc_id = ?', {
    replacements: [calcId],
  });
  await sequelize.close();
  return Number((rows as { id: number }[])[0].id);
}

/** One visit: ms from navigation to usable, API calls, the slowest call's server time, script bytes. */
async function visit(page: Page, s: Screen) {
  const api: { url: string; serverMs: number }[] = [];
  let scriptBytes = 0;
  const onResponse = async (res: import('playwright-core').Response) => {
    const url = new URL(res.url());
    if (url.pathname.startsWith('/api/')) {
      const timing = (await res.allHeaders())['server-timing'] ?? '';
      const total = /app;dur=([\d.]+)/.exec(timing);
      api.push({ url: url.pathname, serverMs: total ? Number(total[1]) : NaN });
    } else if (url.pathname.endsWith('.js')) scriptBytes += Number((await res.allHeaders())['content-length'] ?? 0);
  };
  page.on('response', onResponse);
  const started = Date.now();
  await page.goto(s.url);
  await s.ready(page);
  const ms = Date.now() - started;
  page.off('response', onResponse);
  const trace = TRACE ? await waterfall(page, ms) : [];
  const slowest = api.reduce((a, b) => (b.serverMs > a.serverMs ? b : a), { url: '-', serverMs: 0 });
  return { ms, calls: api.length, slowest, scriptKb: scriptBytes / 1024, trace };
}

runInBrowser(async (browser, url) => {
  const list = (await screens()).filter((s) => !ONLY || ONLY.includes(s.name));
  console.log(
    `Screens, navigation to usable in headless Chromium (median of ${RUNS}; after sign-in, scripts cached as a returning user has them):`,
  );
  for (const s of list) {
    const page = await signedInPage(browser, url, s.user);
    const first = await visit(page, s);
    const runs = [first];
    for (let i = 1; i < RUNS; i++) runs.push(await visit(page, s));
    const sorted = runs.map((r) => r.ms).sort((a, b) => a - b);
    const median = sorted[Math.floor(sorted.length / 2)];
    console.log(
      `  ${s.name.padEnd(14)} ${String(median).padStart(5)} ms (first ${first.ms} ms)  ${first.calls} API calls, slowest ${first.slowest.url} ` +
        `${first.slowest.serverMs.toFixed(0)} ms on the server, ${first.scriptKb.toFixed(0)} kB script on first visit`,
    );
    for (const line of first.trace) console.log(line);
    await page.context().close();
  }
});

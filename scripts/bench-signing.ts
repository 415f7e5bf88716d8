// Signing benchmark: how long the calc page takes, in Debian's headless Chromium against the demo database, from
// the click that confirms a return or a signature in its dialog to the page showing the revision's new state, with
// the server's own time for that request (Server-Timing). Prints figures only; tests never depend on them.
import type { Locator, Page } from 'playwright-core';
import { runInBrowser, signedInPage } from './bench-browser';
import { prepareRevisions, type Action, type Prepared } from './bench-signing-prep';
import { DEMO_PASSWORD } from '../server/db/demo-data';

const RUNS = Number(process.env.BENCH_SIGN_RUNS ?? 5);

interface Act {
  action: Action;
  name: string;
  user: string;
  /** The calc page's button that opens the dialog, and the dialog's button that confirms. */
  opens: string;
  confirms: string;
  fill: (dialog: Locator) => Promise<void>;
  /** The state the revision is in afterwards, and the request that makes it so. */
  state: string;
  request: RegExp;
}

const password = (dialog: Locator) => dialog.getByLabel('Your password').fill(DEMO_PASSWORD);
const ACTS: Act[] = [
  {
    action: 'return',
    name: 'return to author',
    user: 'checker',
    opens: 'Return to author',
    confirms: 'Return',
    fill: (d) => d.getByLabel('What must change').fill('Show where the belt tension on the tail pulley comes from.'),
    state: 'returned',
    request: /\/api\/revisions\/\d+\/return$/,
  },
  {
    action: 'checked',
    name: 'sign as checked',
    user: 'checker',
    opens: 'Sign as checked',
    confirms: 'Sign',
    fill: password,
    state: 'checked',
    request: /\/api\/revisions\/\d+\/sign$/,
  },
  {
    action: 'approved',
    name: 'approve',
    user: 'approver',
    opens: 'Approve',
    confirms: 'Sign',
    fill: password,
    state: 'approved',
    request: /\/api\/revisions\/\d+\/sign$/,
  },
];

interface Run {
  ms: number;
  /** When the browser sent the request and when its answer came (after the click); the rest is the page's work. */
  sentMs: number;
  answerMs: number;
  phases: Map<string, number>;
}

/**
 * One action on its own revision, timed on the page's own clock (no round trips to the bench counted): from the
 * confirming click's event to the first animation frame showing the new state; the request's times and the server's
 * phases come from the browser's resource timing.
 */
async function once(page: Page, act: Act, p: Prepared): Promise<Run> {
  await page.goto(`/calcs/${p.calcId}`);
  const status = page.locator('section.main .status');
  await status.getByRole('button', { name: act.opens }).waitFor();
  const before = (await status.locator('p.next').textContent()) ?? '';
  await status.getByRole('button', { name: act.opens }).click();
  const dialog = page.locator('mat-dialog-container');
  await act.fill(dialog);
  const confirm = dialog.getByRole('button', { name: act.confirms, exact: true, disabled: false });
  await confirm.waitFor();
  await page.evaluate(() => {
    const w = window as unknown as { benchClick?: number };
    document.addEventListener('click', (e) => (w.benchClick = e.timeStamp), { capture: true, once: true });
  });
  await confirm.click();
  const shown = await page.waitForFunction(
    ({ state, before }) => {
      const status = document.querySelector('section.main .status');
      const next = status?.querySelector('p.next')?.textContent ?? before;
      const done = status?.querySelector(`tt-state-badge [data-state="${state}"]`) && !next.includes(before);
      return done && !document.querySelector('mat-dialog-container') ? performance.now() : false;
    },
    { state: act.state, before },
    { polling: 'raf' },
  );
  const end = (await shown.jsonValue()) as number;
  const seen = await page.evaluate((source) => {
    const clicked = (window as unknown as { benchClick: number }).benchClick;
    const entry = (performance.getEntriesByType('resource') as PerformanceResourceTiming[]).find((e) =>
      new RegExp(source).test(new URL(e.name).pathname),
    );
    const phases = (entry?.serverTiming ?? []).map((t) => [t.name, t.duration] as [string, number]);
    return { clicked, sent: entry?.startTime ?? NaN, answered: entry?.responseEnd ?? NaN, phases };
  }, act.request.source);
  const after = (t: number) => Math.round(t - seen.clicked);
  return { ms: after(end), sentMs: after(seen.sent), answerMs: after(seen.answered), phases: new Map(seen.phases) };
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const med = (runs: Run[], key: 'sentMs' | 'answerMs') => median(runs.map((r) => r[key]));

/** The signature's own phases first (app is the whole answer), then the finer ones as the server sent them. */
const MAIN_PHASES = ['app', 'checks', 'password', 'write', 'read'];

function serverLine(runs: Map<string, number>[]): string {
  const seen = [...new Set(runs.flatMap((r) => [...r.keys()]))];
  const names = [...MAIN_PHASES.filter((n) => seen.includes(n)), ...seen.filter((n) => !MAIN_PHASES.includes(n))];
  const parts = names.map((n) => `${n} ${median(runs.map((r) => r.get(n) ?? 0)).toFixed(0)}`);
  return parts.length ? `Server-Timing (median ms): ${parts.join(', ')}` : 'no Server-Timing seen';
}

runInBrowser(async (browser, url) => {
  const actions = ACTS.map((a) => a.action);
  const prepared = await prepareRevisions(url, actions, RUNS);
  console.log(
    `Returning and signing on the calc page in headless Chromium (median of ${RUNS}, each on a revision of its ` +
      'own prepared beforehand):\n  from the click that confirms in the dialog (reason or password typed) to the ' +
      'page showing the new state (dialog closed, state badge and next step updated)',
  );
  for (const act of ACTS) {
    const page = await signedInPage(browser, url, act.user);
    const runs = [];
    for (const p of prepared.filter((x) => x.action === act.action)) runs.push(await once(page, act, p));
    const ms = runs.map((r) => r.ms);
    console.log(
      `  ${act.name.padEnd(17)} ${String(median(ms)).padStart(5)} ms (first ${ms[0]} ms; all ${ms.join(' ')}), ` +
        `request sent after ${med(runs, 'sentMs')} ms, answered after ${med(runs, 'answerMs')} ms`,
    );
    console.log(`    ${serverLine(runs.map((r) => r.phases))}`);
    await page.context().close();
  }
});

// Screen benchmark: how long each main screen takes from navigation to usable, in Debian's headless
// Chromium against the demo database, with the API calls behind it (count, slowest by Server-Timing)
// and the script fetched. Prints figures only; tests never depend on them. Needs the built client.
import type { Page } from 'playwright-core';
import { waterfall } from './bench-screens-trace';
import { runInBrowser, signedInPage } from './bench-browser';
import { screens, type Screen } from './bench-screens-list';

const RUNS = Number(process.env.BENCH_SCREEN_RUNS ?? 3);
/** BENCH_SCREENS="editor,calc page" measures only the named screens (all by default). */
const ONLY = process.env.BENCH_SCREENS?.split(',').map((s) => s.trim());
/** BENCH_SCREEN_TRACE=1 prints each screen's first-visit timeline (scripts, API calls, server phases). */
const TRACE = process.env.BENCH_SCREEN_TRACE === '1';

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

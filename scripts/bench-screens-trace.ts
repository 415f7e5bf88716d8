// Where a screen's time goes: the browser's own resource timeline of one visit (scripts, styles, API calls, each
// with its start and end after navigation, and the server's phases from Server-Timing), plus first paint.
// `BENCH_SCREEN_TRACE=1 npm run bench` prints it under each screen's line; figures only, nothing depends on them.
import type { Page } from 'playwright-core';

interface Entry {
  name: string;
  start: number;
  end: number;
  kind: string;
  server: string;
}

/** The timeline of the page's current document, one line per resource, ending with `usableMs`. */
export async function waterfall(page: Page, usableMs: number): Promise<string[]> {
  const { entries, paint } = await page.evaluate(() => ({
    entries: (performance.getEntriesByType('resource') as PerformanceResourceTiming[]).map((e) => ({
      name: new URL(e.name).pathname,
      start: e.startTime,
      end: e.responseEnd,
      kind: e.initiatorType,
      server: e.serverTiming.map((t) => `${t.name} ${t.duration.toFixed(0)}`).join(', '),
    })),
    paint: performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? NaN,
  }));
  const nav = await page.evaluate(() => {
    const n = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming | undefined;
    return n ? { html: n.responseEnd, dom: n.domContentLoadedEventEnd } : { html: NaN, dom: NaN };
  });
  const row = (from: number, to: number, what: string) =>
    `      ${from.toFixed(0).padStart(5)} → ${to.toFixed(0).padStart(5)} ms  ${what}`;
  return [
    row(0, nav.html, 'page (index.html)'),
    ...(entries as Entry[]).map((e) =>
      row(e.start, e.end, `${e.kind.padEnd(6)} ${e.name}${e.server ? `  [server: ${e.server}]` : ''}`),
    ),
    row(nav.dom, nav.dom, 'DOM content loaded'),
    row(paint, paint, 'first contentful paint'),
    row(usableMs, usableMs, 'usable (as measured from the test side)'),
  ];
}

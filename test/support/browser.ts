import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { chromium, type BrowserContext, type Locator, type Page } from 'playwright-core';
import { startTestApp, TEST_PASSWORD } from './api-harness';

export const SCREENSHOT_DIR = path.resolve(__dirname, '../../artifacts/screenshots');

/**
 * Screenshots are pictures for people to look at, not checks: they are taken only when SCREENSHOTS=1 (`npm run
 * screens`), and `npm test` skips them. In the browser specs they cost about 40 % of the screens spec's CPU time
 * (DEVELOPERS.md, "Tests"). Every layout, keyboard and axe check runs either way.
 */
export const SCREENSHOTS_WANTED = process.env.SCREENSHOTS === '1';

/** What a person sees without scrolling (a page), or one element (a locator), saved as `<name>.png`. */
export async function screenshotAsSeen(target: Page | Locator, name: string): Promise<void> {
  if (SCREENSHOTS_WANTED) await target.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`) });
}

// Debian's chromium, started the way this machine allows: no sandbox as root, no background network.
const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** The real app on a free loopback port, plus a fresh Chromium profile. */
export async function startBrowserSession() {
  const { app, close } = startTestApp();
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'tt-chromium-'));
  const context: BrowserContext = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: CHROMIUM_ARGS,
    viewport: { width: 1360, height: 860 },
    baseURL: baseUrl,
  });
  // A busy two-core machine can make one step slow; patience, not timing, is tested (the audit-tampering
  // specs that used to hold the chain lock now work in a database of their own).
  context.setDefaultTimeout(120_000);
  context.setDefaultNavigationTimeout(120_000);
  const outsideRequests: string[] = [];
  context.on('request', (req) => {
    const url = new URL(req.url());
    if (!['data:', 'blob:'].includes(url.protocol) && url.hostname !== '127.0.0.1') outsideRequests.push(req.url());
  });
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  return {
    baseUrl,
    context,
    outsideRequests,
    /** The whole page, scrolled through, saved as `<name>.png` (only when SCREENSHOTS=1, see above). */
    async screenshot(page: Page, name: string): Promise<void> {
      if (SCREENSHOTS_WANTED) await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
    },
    async close() {
      await context.close();
      await new Promise((resolve) => server.close(resolve));
      await close(); // the app's worker pool, sockets and timers, then the database
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * Opens `path` signed out. The page leaves the app first (about:blank ends its scripts and cancels what it still has
 * in flight), then the cookies go: sessions roll, so an answer arriving after the cookies were cleared set the old
 * session's cookie again, and the sign-in page then sent the signed-in reader on to the overview (a keyboard spec
 * waited 120 s for the username field that way).
 */
export async function openSignedOut(context: BrowserContext, page: Page, path = '/sign-in'): Promise<void> {
  await page.goto('about:blank');
  await context.clearCookies();
  await page.goto(path);
}

/** Signs in through the real page, from signed out, and waits for the overview's greeting. */
export async function signInThroughPage(context: BrowserContext, page: Page, username: string): Promise<void> {
  await openSignedOut(context, page);
  await page.getByLabel('Username').fill(username);
  await page.getByLabel('Password', { exact: true }).fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
}

/**
 * Waits until the page is finished: nothing loading, no editor panel or plot still to be built, its web fonts in
 * (until then text is set in a wider fallback font), and no opening animation still running (a dialog fading in read
 * as grey text on grey to axe's contrast check once; endless ones, such as a spinner, are not waited for). Layout and
 * axe checks then read the page a person would read, not one moment of its loading.
 */
export async function pageSettled(page: Page): Promise<void> {
  await page.waitForFunction(
    () =>
      document.fonts.status === 'loaded' &&
      !document.querySelector('mat-progress-bar, tt-panel-placeholder, .plots-wait') &&
      document
        .getAnimations()
        .every((a) => a.playState !== 'running' || a.effect?.getComputedTiming().iterations === Infinity),
  );
}

/**
 * Runs axe-core in the page and returns the serious and critical violations, one line each. axe's source (about
 * half a megabyte) is sent only when the page does not hold it yet, and the page sends back those lines rather than
 * axe's whole result (every rule it ran): both went over the DevTools protocol on every check before.
 */
export async function accessibilityViolations(page: Page): Promise<string[]> {
  // Evaluated over the DevTools protocol: the app's CSP (rightly) refuses injected script tags.
  if (!(await page.evaluate(() => 'axe' in window)))
    await page.evaluate(fs.readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8'));
  return page.evaluate(async () => {
    const axe = (
      window as unknown as {
        axe: {
          run: (
            ctx: Document,
            opts: object,
          ) => Promise<{ violations: { id: string; impact: string; nodes: { target: string[] }[] }[] }>;
        };
      }
    ).axe;
    const { violations } = await axe.run(document, { resultTypes: ['violations'] });
    return violations
      .filter((v) => v.impact === 'serious' || v.impact === 'critical')
      .map(
        (v) =>
          `${v.id}: ${v.nodes
            .map((n) => n.target.join(' '))
            .slice(0, 3)
            .join(', ')}`,
      );
  });
}

// Browser helpers of the screen and signing benchmarks: the server, Debian's headless Chromium, a signed-in page.
import { chromium, type Browser, type Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../server/db/demo-data';
import { startServer } from './bench-http';

export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update'],
  });
}

/** Signs a demo person in through the sign-in screen and waits for the overview's greeting. */
export async function signInPage(page: Page, username: string): Promise<void> {
  await page.context().clearCookies();
  await page.goto('/sign-in');
  await page.getByLabel('Username').fill(username);
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
}

/** Starts the server and Chromium, runs `work` with them, stops both after; a failure is printed and exits 1. */
export function runInBrowser(work: (browser: Browser, url: string) => Promise<void>): void {
  const run = async () => {
    // Phases on: the screens and signing benches print where the server's time went (off by default, config.ts).
    const { url, child } = await startServer({
      LOG_LEVEL: 'silent',
      MAIL_SENDER: 'false',
      SERVER_TIMING_PHASES: 'true',
    });
    const browser = await launchChromium();
    try {
      await work(browser, url);
    } finally {
      await browser.close();
      child.kill();
    }
  };
  run().catch((err) => {
    console.error(err);
    process.exit(1);
  });
}

/** A page of its own, at the benches' viewport, signed in as `username`. */
export async function signedInPage(browser: Browser, url: string, username: string): Promise<Page> {
  const context = await browser.newContext({ baseURL: url, viewport: { width: 1440, height: 900 } });
  const page = await context.newPage();
  await signInPage(page, username);
  return page;
}

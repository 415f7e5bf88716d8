import type { Express } from 'express';
import type { Page } from 'playwright-core';
import { signInThroughPage, startBrowserSession } from './browser';
import { startTestS3 } from './fake-servers';

type BrowserSession = Awaited<ReturnType<typeof startBrowserSession>>;

/**
 * One browser spec's set-up: the real app and Chromium started before the file's tests and closed
 * after them (both registered here), optionally with an s3rver of its own for attachments.
 */
export function browserSuite(options: { s3?: boolean } = {}) {
  let session: BrowserSession | undefined;
  let s3: Awaited<ReturnType<typeof startTestS3>> | undefined;
  beforeAll(async () => {
    if (options.s3) {
      s3 = await startTestS3();
      // The browser's app reads its configuration from the environment, like a real server.
      Object.assign(process.env, s3.config);
    }
    session = await startBrowserSession();
  });
  afterAll(async () => {
    await session?.close();
    await s3?.close();
  });
  const started = () => {
    if (!session) throw new Error('the browser session is read before beforeAll started it');
    return session;
  };

  /** Signs in through the real page and waits for the overview's greeting. */
  const signIn = (page: Page, username: string) => signInThroughPage(started().context, page, username);

  return {
    get session() {
      return started();
    },
    // Set-up goes through the same server the browser uses (supertest accepts its URL).
    server: () => started().baseUrl as unknown as Express,
    signIn,
    /** A new tab, signed in as `username`. */
    async signedInPage(username: string): Promise<Page> {
      const page = await started().context.newPage();
      await signIn(page, username);
      return page;
    },
  };
}

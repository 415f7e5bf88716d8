import type { Config } from '../../server/config';
import { startTestApp } from './api-harness';
import { startTestS3 } from './fake-servers';

/**
 * A real app whose attachments go to an s3rver of its own, started before the file's tests and
 * closed after them (both registered here). Read `app`, `sequelize` and `config` inside tests.
 */
export function appWithTestS3(overrides: Partial<Config> = {}) {
  let s3: Awaited<ReturnType<typeof startTestS3>> | undefined;
  let ctx: ReturnType<typeof startTestApp> | undefined;
  beforeAll(async () => {
    s3 = await startTestS3();
    ctx = startTestApp({ ...s3.config, ...overrides });
  });
  afterAll(async () => {
    await ctx?.close();
    await s3?.close();
  });
  const started = () => {
    if (!ctx) throw new Error('the S3-backed test app is read before beforeAll started it');
    return ctx;
  };
  return {
    get app() {
      return started().app;
    },
    get sequelize() {
      return started().sequelize;
    },
    get config() {
      return started().config;
    },
  };
}

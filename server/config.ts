import { availableParallelism } from 'node:os';
import { z } from 'zod';

/**
 * The process configuration, read from the environment once and validated, so a typo in a
 * variable stops the server at start-up instead of surfacing as odd behaviour later.
 * Defaults are for development on one machine only; production sets every secret.
 */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4300),
  HOST: z.string().default('127.0.0.1'),
  PUBLIC_URL: z.string().optional(),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().positive().default(3406),
  DB_NAME: z.string().default('torquetrail'),
  DB_USER: z.string().default('torquetrail'),
  DB_PASSWORD: z.string().default('torquetrail-dev'),
  DB_POOL_MAX: z.coerce.number().int().positive().default(10),
  // How long a request waits for a free connection before it fails. npm test raises it: its specs run
  // beside other work on a small machine, where a short wait turns a slow moment into a failed test.
  DB_ACQUIRE_MS: z.coerce.number().int().positive().default(30_000),
  SESSION_SECRET: z.string().min(16).default('dev-only-session-secret-change-me'),
  SESSION_IDLE_MINUTES: z.coerce.number().positive().default(30),
  SESSION_ABSOLUTE_HOURS: z.coerce.number().positive().default(12),
  // Behind TLS the cookie must be Secure and HSTS makes sense; on plain HTTP both break sign-in.
  TLS: z.stringbool().default(false),
  // Whose X-Forwarded-For to believe. Off by default: trusting even loopback lets anyone on the host
  // forge the client address (sign-in limit, audit trail). Set it to the load balancer's address(es).
  TRUST_PROXY: z.string().default('false').transform(trustProxySetting),
  LOGIN_RATE_LIMIT: z.coerce.number().int().positive().default(10),
  LOGIN_RATE_WINDOW_MINUTES: z.coerce.number().positive().default(15),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  CLIENT_DIST: z.string().default('dist/torquetrail/browser'),
  // Shown in the top bar; the default is the invented demo company.
  ORG_NAME: z.string().max(80).default('Kestrel Fen Drives'),
  // Hand-over mail: a local fake SMTP server in development and tests; a real relay is only these values.
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  SMTP_SECURE: z.stringbool().default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3).default('Torquetrail <torquetrail@localhost>'),
  MAIL_SENDER: z.stringbool().default(true),
  MAIL_POLL_SECONDS: z.coerce.number().positive().default(2),
  MAIL_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(50).default(10),
  MAIL_BACKOFF_SECONDS: z.coerce.number().positive().default(30),
  // The admin screen shows mail bodies; a deployment that must not expose them turns it off.
  SENT_MAIL_SCREEN: z.stringbool().default(true),
  // Every answer's Server-Timing header gives its whole time; this adds each phase (read, lock, engine, commit …).
  // Finding a request's phases deep in its work needs Node's async context tracking, a step on every promise the
  // process makes: 4–7 % of the app's CPU an answer on the list bench (DEVELOPERS.md, "Measuring speed"), so it is
  // off unless an operator switches it on while finding where a slow answer's time goes. The screen and signing
  // benches switch it on for themselves.
  SERVER_TIMING_PHASES: z.stringbool().default(false),
  // Attachments live in object storage through the S3 API; the defaults match scripts/fake-services.ts.
  S3_ENDPOINT: z.url().default('http://127.0.0.1:4569'),
  S3_REGION: z.string().default('us-east-1'),
  S3_BUCKET: z.string().min(3).default('torquetrail-attachments'),
  S3_ACCESS_KEY_ID: z.string().default('S3RVER'),
  S3_SECRET_ACCESS_KEY: z.string().default('S3RVER'),
  S3_FORCE_PATH_STYLE: z.stringbool().default(true),
  ATTACHMENT_MAX_MB: z.coerce.number().positive().max(500).default(20),
  EVIDENCE_PACK_MAX_MB: z.coerce.number().positive().max(2000).default(100),
  REPORT_FONT_DIR: z.string().default('/usr/share/fonts/truetype/dejavu'),
  // Evidence-pack checks and report PDFs run in worker threads: how many at once, each worker's
  // heap limit, and how many may wait before a 503. Unpacked pack bytes live outside the heap and
  // are bounded per job by twice EVIDENCE_PACK_MAX_MB, so at most WORK_THREADS times that at once.
  // By default one core is left to the event loop.
  WORK_THREADS: z.coerce
    .number()
    .int()
    .min(1)
    .max(16)
    .default(Math.min(4, Math.max(1, availableParallelism() - 1))),
  WORK_MEMORY_MB: z.coerce.number().int().min(64).max(4096).default(512),
  WORK_QUEUE: z.coerce.number().int().min(0).max(1000).default(32),
});

/**
 * Express's `trust proxy` value: false (the default), a hop count, or a comma-separated list of
 * addresses, subnets or the names Express knows (loopback, linklocal, uniquelocal). `true` would
 * trust any sender, which is never right for a sign-in limit, so it is refused.
 */
function trustProxySetting(value: string, ctx: z.RefinementCtx): false | number | string {
  const v = value.trim().toLowerCase();
  if (v === '' || v === 'false' || v === '0') return false;
  if (v === 'true') {
    ctx.addIssue({
      code: 'custom',
      message: 'must name the proxy addresses or a hop count, not "true" (that trusts every sender)',
    });
    return z.NEVER;
  }
  if (/^\d+$/.test(v)) return Number(v);
  return v;
}

export type Config = Readonly<z.infer<typeof envSchema>>;

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  if (parsed.data.NODE_ENV === 'production' && parsed.data.SESSION_SECRET.startsWith('dev-only')) {
    // Not fatal: `npm start` runs the demo in production mode on one machine. Logged loudly instead.
    process.emitWarning('SESSION_SECRET is the development default; set it before exposing the server.');
  }
  return Object.freeze(parsed.data);
}

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
  SESSION_SECRET: z.string().min(16).default('dev-only-session-secret-change-me'),
  SESSION_IDLE_MINUTES: z.coerce.number().positive().default(30),
  SESSION_ABSOLUTE_HOURS: z.coerce.number().positive().default(12),
  // Behind TLS the cookie must be Secure and HSTS makes sense; on plain HTTP both break sign-in.
  TLS: z.stringbool().default(false),
  TRUST_PROXY: z.string().default('loopback'),
  LOGIN_RATE_LIMIT: z.coerce.number().int().positive().default(10),
  LOGIN_RATE_WINDOW_MINUTES: z.coerce.number().positive().default(15),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  CLIENT_DIST: z.string().default('dist/torquetrail/browser'),
  // Shown in the top bar; the default is the invented demo company.
  ORG_NAME: z.string().max(80).default('Kestrel Fen Drives'),
});

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

import path from 'node:path';
import fs from 'node:fs';
import express, { type Express } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from './config';
import { serverTiming } from './http/server-timing';
import { apiNoStore, securityHeaders } from './http/security-headers';
import { jsonBody } from './http/json-body';
import { inSequence } from './http/in-sequence';
import { sessionMiddleware, absoluteSessionLimit } from './auth/session';
import { createPassport, installSignInMethods, sessionPerson } from './auth/passport';
import { csrfProtection } from './auth/csrf';
import { healthCheck } from './http/health';
import { attachAbility } from './authz/actor';
import { requireSignIn } from './authz/require-sign-in';
import { apiNotFound, errorHandler } from './errors/error-handler';
import { createServices } from './services';
import { apiMounts } from './routes';
import { installPlainWords } from '../shared/schemas/plain-words';

export interface AppDeps {
  sequelize: Sequelize;
  config: Config;
}

// What each app holds open (worker threads, object-store sockets, the session sweep timer), for closeApp.
const closers = new WeakMap<Express, () => Promise<void>>();

/** Builds the Express app (API and, when built, the client) without listening; closeApp(app) releases it. */
export function createApp({ sequelize, config }: AppDeps): Express {
  installPlainWords();
  const app = express();
  const passport = createPassport();
  app.disable('x-powered-by');
  app.set('etag', false);
  app.set('trust proxy', config.TRUST_PROXY);

  installSignInMethods(app, passport);

  app.use(securityHeaders(config));
  app.get('/api/health', healthCheck(sequelize));
  const sessions = sessionMiddleware(sequelize, config);
  // What every API request passes through before its route, in this order, as one layer (in-sequence.ts).
  app.use(
    '/api',
    inSequence(
      apiNoStore,
      serverTiming(config.SERVER_TIMING_PHASES),
      ...jsonBody('1mb'),
      sessions.middleware,
      absoluteSessionLimit(config),
      sessionPerson,
      attachAbility,
      csrfProtection,
    ),
  );

  const services = createServices(sequelize, config);
  for (const mount of apiMounts({ sequelize, config, passport, services })) {
    app.use(mount.path, ...(mount.public ? [] : [requireSignIn]), ...mount.routers);
  }
  app.use('/api', apiNotFound);

  serveClient(app, config);
  app.use(errorHandler);
  closers.set(app, async () => {
    sessions.close();
    await services.close();
  });
  return app;
}

/**
 * Stops what createApp started (not the database: its owner closes that). Safe to call twice.
 * Without it the worker pool and sockets keep a test worker or a stopping server alive.
 */
export async function closeApp(app: Express): Promise<void> {
  const close = closers.get(app);
  closers.delete(app);
  await close?.();
}

function serveClient(app: Express, config: Config): void {
  const dist = path.resolve(__dirname, '..', config.CLIENT_DIST);
  const index = path.join(dist, 'index.html');
  if (!fs.existsSync(index)) return;
  // The build names scripts, styles and fonts by their content (main-3KQ2XYZA.js): such a name never changes
  // content, so a browser keeps it a year without asking again; other files (the logo) are checked hourly.
  const isHashed = (file: string) => /-[A-Z0-9]{8}\.(js|css|woff2?|ttf)$/.test(file);
  app.use(
    express.static(dist, {
      index: false,
      maxAge: '1h',
      setHeaders: (res, file) => {
        if (isHashed(file)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
      },
    }),
  );
  // Client-side routes all load the same page; the Angular router takes it from there.
  app.get('/{*splat}', (_req, res) => res.sendFile(index, { maxAge: 0 }));
}

import path from 'node:path';
import fs from 'node:fs';
import express, { type Express } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from './config';
import { serverTiming } from './http/server-timing';
import { securityHeaders } from './http/security-headers';
import { jsonBody } from './http/json-body';
import { sessionMiddleware, absoluteSessionLimit } from './auth/session';
import { createPassport } from './auth/passport';
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

/** Builds the Express app (API and, when built, the client) without listening. */
export function createApp({ sequelize, config }: AppDeps): Express {
  installPlainWords();
  const app = express();
  const passport = createPassport();
  app.disable('x-powered-by');
  app.set('trust proxy', config.TRUST_PROXY);

  app.use(securityHeaders(config));
  app.get('/api/health', healthCheck(sequelize));
  app.use('/api', serverTiming());
  app.use('/api', jsonBody('1mb'));
  app.use('/api', sessionMiddleware(sequelize, config), absoluteSessionLimit(config));
  app.use('/api', passport.session(), attachAbility);
  app.use('/api', csrfProtection);

  const services = createServices(sequelize, config);
  for (const mount of apiMounts({ sequelize, config, passport, services })) {
    app.use(mount.path, ...(mount.public ? [] : [requireSignIn]), ...mount.routers);
  }
  app.use('/api', apiNotFound);

  serveClient(app, config);
  app.use(errorHandler);
  return app;
}

function serveClient(app: Express, config: Config): void {
  const dist = path.resolve(__dirname, '..', config.CLIENT_DIST);
  const index = path.join(dist, 'index.html');
  if (!fs.existsSync(index)) return;
  app.use(express.static(dist, { index: false, maxAge: '1h' }));
  // Client-side routes all load the same page; the Angular router takes it from there.
  app.get('/{*splat}', (_req, res) => res.sendFile(index, { maxAge: 0 }));
}

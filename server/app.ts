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
import { authRouter } from './auth/auth.router';
import { healthCheck } from './http/health';
import { secondFactorRouter } from './auth/second-factor.router';
import { sessionsRouter } from './auth/sessions.router';
import { attachAbility } from './authz/actor';
import { requireSignIn } from './authz/require-sign-in';
import { usersRouter } from './users/users.router';
import { roleGrantsRouter } from './users/role-grants.router';
import { projectsRouter } from './projects/projects.router';
import { auditRouter } from './audit/audit.router';
import { dashboardRouter } from './dashboard/dashboard.router';
import { apiNotFound, errorHandler } from './errors/error-handler';
import { calcsRouter } from './calcs/calcs.router';
import { revisionsRouter, findingsRouter, type RevisionServices } from './revisions/revisions.router';
import { CalcsService } from './calcs/calcs.service';
import { LifecycleService } from './calcs/lifecycle.service';
import { WorkflowService } from './workflow/workflow.service';
import { ReviewService } from './workflow/review.service';
import { ruleSetsRouter } from './rule-sets/rule-sets.router';
import { RuleSetsService } from './rule-sets/rule-sets.service';
import { ImpactService } from './rule-sets/impact.service';
import { recordsRouters } from './evidence/records-routers';
import { reviewHealthRouter } from './review-health/review-health.router';

export interface AppDeps {
  sequelize: Sequelize;
  config: Config;
}

/** Builds the Express app (API and, when built, the client) without listening. */
export function createApp({ sequelize, config }: AppDeps): Express {
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

  app.use('/api', authRouter(sequelize, passport, config));
  app.use('/api/auth/second-factor', requireSignIn, secondFactorRouter(sequelize));
  app.use('/api/auth/sessions', requireSignIn, sessionsRouter(sequelize));
  app.use('/api/users', requireSignIn, usersRouter(sequelize));
  app.use('/api/role-grants', requireSignIn, roleGrantsRouter(sequelize));
  app.use('/api/projects', requireSignIn, projectsRouter(sequelize));
  app.use('/api/audit', requireSignIn, auditRouter());
  app.use('/api/dashboard', requireSignIn, dashboardRouter());
  const services = calcServices(sequelize, config);
  app.use('/api/calcs', requireSignIn, calcsRouter(services.calcs, services.lifecycle));
  app.use('/api/revisions', requireSignIn, revisionsRouter(services));
  app.use('/api/findings', requireSignIn, findingsRouter(services.review));
  const impact = new ImpactService(sequelize);
  const ruleSets = new RuleSetsService(sequelize, (actor, id) => impact.notifyIfAffected(actor, id));
  app.use('/api/rule-sets', requireSignIn, ruleSetsRouter(ruleSets, impact));
  for (const [path, router] of recordsRouters(sequelize, config)) app.use(path, requireSignIn, router);
  app.use('/api/review-health', requireSignIn, reviewHealthRouter(sequelize));
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

function calcServices(sequelize: Sequelize, config: Config): RevisionServices {
  const calcs = new CalcsService(sequelize);
  const workflow = new WorkflowService(sequelize, config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}`);
  return { calcs, workflow, lifecycle: new LifecycleService(sequelize, calcs), review: new ReviewService(sequelize, workflow) };
}

import type { Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from './config';
import type { AppPassport } from './auth/passport';
import type { Services } from './services';
import { authRouter } from './auth/auth.router';
import { secondFactorRouter } from './auth/second-factor.router';
import { sessionsRouter } from './auth/sessions.router';
import { usersRouter } from './users/users.router';
import { roleGrantsRouter } from './users/role-grants.router';
import { projectsRouter } from './projects/projects.router';
import { auditRouter } from './audit/audit.router';
import { dashboardRouter } from './dashboard/dashboard.router';
import { calcsRouter } from './calcs/calcs.router';
import { evidenceRouter } from './evidence/evidence.router';
import { revisionsRouter, findingsRouter } from './revisions/revisions.router';
import { independentModelRouter } from './independent/independent-model.router';
import { reviewHealthRouter } from './review-health/review-health.router';
import { revisionAttachmentsRouter, attachmentsRouter } from './attachments/attachments.router';
import { reportRouter } from './reports/report.router';
import { ruleSetsRouter } from './rule-sets/rule-sets.router';
import { mailRouter } from './mail/mail.router';
import { verifyRouter } from './verify/verify.router';
import { engineMetadataRouter } from './calcs/engine-metadata.router';

/**
 * One API area: its path, once, and the routers that serve it, tried in order. `public` areas
 * answer without a session (their routes guard themselves); every other area is behind sign-in.
 */
export interface ApiMount {
  path: string;
  routers: Router[];
  public?: true;
}

interface MountDeps {
  sequelize: Sequelize;
  config: Config;
  passport: AppPassport;
  services: Services;
}

/** Every API route of the app, by area: a new router is added here and nowhere else. */
export function apiMounts({ sequelize, config, passport, services: s }: MountDeps): ApiMount[] {
  const org = config.ORG_NAME;
  return [
    // GET /session, POST /auth/login and /auth/logout; /auth/password requires sign-in itself.
    { path: '/api', routers: [authRouter(sequelize, passport, config)], public: true },
    { path: '/api/auth/second-factor', routers: [secondFactorRouter(sequelize)] },
    { path: '/api/auth/sessions', routers: [sessionsRouter(sequelize)] },
    { path: '/api/users', routers: [usersRouter(sequelize)] },
    { path: '/api/role-grants', routers: [roleGrantsRouter(sequelize)] },
    { path: '/api/projects', routers: [projectsRouter(sequelize)] },
    { path: '/api/audit', routers: [auditRouter()] },
    { path: '/api/dashboard', routers: [dashboardRouter()] },
    { path: '/api/calcs', routers: [calcsRouter(s.calcs, s.lifecycle), evidenceRouter(s.evidence, org, s.baseUrl)] },
    {
      path: '/api/revisions',
      routers: [
        revisionsRouter(s),
        revisionAttachmentsRouter(s.attachments),
        reportRouter(s.reports, org, s.baseUrl),
        independentModelRouter(s.independent),
      ],
    },
    { path: '/api/engine-metadata', routers: [engineMetadataRouter(sequelize)] },
    { path: '/api/findings', routers: [findingsRouter(s.findings)] },
    { path: '/api/rule-sets', routers: [ruleSetsRouter(s.ruleSets, s.impact)] },
    { path: '/api/mail', routers: [mailRouter(sequelize, s.sentMail)] },
    { path: '/api/attachments', routers: [attachmentsRouter(s.attachments)] },
    { path: '/api/verify', routers: [verifyRouter(s.packs)] },
    { path: '/api/review-health', routers: [reviewHealthRouter(sequelize)] },
  ];
}

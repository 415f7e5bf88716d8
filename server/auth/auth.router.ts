import { Router, type Request } from 'express';
import type { AppPassport as Passport } from './passport';
import type { Sequelize } from 'sequelize';
import { changePasswordSchema, loginSchema, type SessionUser } from '../../shared/schemas/auth.schema';
import type { Config } from '../config';
import { AppError } from '../errors/app-error';
import { validate } from '../http/validate';
import { requireSignIn } from '../authz/require-sign-in';
import { abilityOf, actorOf, signedInActor } from '../authz/actor';
import { AuthService } from './auth.service';
import { csrfToken } from './csrf';
import { clientIp } from '../http/client-ip';
import { loginRateLimit } from './login-rate-limit';

function sessionBody(req: Request, user: SessionUser | null, config: Config) {
  return { user, rules: abilityOf(user).rules, csrfToken: csrfToken(req, false), organisation: config.ORG_NAME };
}

function authenticate(
  passport: Passport,
  req: Request,
): Promise<{ user: SessionUser | false; info?: { message?: string } }> {
  return new Promise((resolve, reject) => {
    passport.authenticate('local', (err: unknown, user: SessionUser | false, info?: { message?: string }) =>
      err ? reject(err) : resolve({ user, info }),
    )(req);
  });
}

/**
 * Signs the person in and records it as one unit. The new session's cookie only reaches the
 * browser with this response, so the session is unusable until the audit entry has committed;
 * if the entry cannot be written, the session is ended again and the request fails. A sign-in
 * that cannot be audited does not happen. (The audit transaction is not held open around the
 * session write: both need a pooled connection, and a burst of sign-ins could exhaust the pool.)
 */
async function signInRecorded(service: AuthService, req: Request, user: SessionUser): Promise<void> {
  // passport ≥ 0.6 regenerates the session on login, so a planted session id is useless.
  await new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
  try {
    req.session.startedAt = Date.now();
    req.session.clientIp = clientIp(req) ?? '';
    req.session.userAgent = req.get('user-agent') ?? '';
    await service.recordSignIn({ id: user.id, name: user.displayName, ip: clientIp(req) });
  } catch (err) {
    await endSession(req);
    throw err;
  }
}

async function endSession(req: Request): Promise<void> {
  await new Promise<void>((resolve) => req.logout(() => resolve()));
  await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
}

export function authRouter(sequelize: Sequelize, passport: Passport, config: Config): Router {
  const router = Router();
  const service = new AuthService(sequelize);

  router.get('/session', (req, res) => {
    res.json(sessionBody(req, req.user ?? null, config));
  });

  router.post('/auth/login', loginRateLimit(sequelize, config), validate({ body: loginSchema }), async (req, res) => {
    const { user, info } = await authenticate(passport, req);
    if (!user) {
      await service.recordFailedSignIn(req.body.username, clientIp(req), info?.message ?? 'unknown user');
      throw new AppError('sign_in_failed', 401, 'Username or password is not correct');
    }
    await signInRecorded(service, req, user);
    res.json(sessionBody(req, user, config));
  });

  router.post('/auth/logout', async (req, res) => {
    if (req.user) await service.recordSignOut(actorOf(req));
    await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    res.status(204).end();
  });

  router.post('/auth/password', requireSignIn, validate({ body: changePasswordSchema }), async (req, res) => {
    // Every other session of the person ends with the old password; this one stays signed in.
    await service.changePassword(
      req.ability,
      signedInActor(req),
      req.body.currentPassword,
      req.body.newPassword,
      req.sessionID,
    );
    res.status(204).end();
  });

  return router;
}

import session from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config';

export const SESSION_COOKIE = 'tt.sid';

/**
 * Sessions live in MariaDB, so they survive a restart and every app instance behind a load
 * balancer sees the same ones. `rolling` renews the idle deadline on each response; the
 * absolute deadline is enforced by `absoluteSessionLimit` below.
 */
export function sessionMiddleware(sequelize: Sequelize, config: Config): RequestHandler {
  const SequelizeStore = connectSessionSequelize(session.Store);
  const store = new SequelizeStore({
    db: sequelize,
    table: 'Session',
    checkExpirationInterval: 15 * 60 * 1000,
    // Recording the user id lets deactivation end all of that person's sessions.
    extendDefaultFields: (defaults: { data: string; expires: Date }, s: { passport?: { user?: number } }) => ({
      data: defaults.data, expires: defaults.expires, userId: s.passport?.user ?? null,
    }),
  });
  return session({
    name: SESSION_COOKIE,
    secret: config.SESSION_SECRET,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: config.TLS,
    cookie: { httpOnly: true, sameSite: 'lax', secure: config.TLS, maxAge: config.SESSION_IDLE_MINUTES * 60_000 },
  });
}

export function absoluteSessionLimit(config: Config): RequestHandler {
  const limitMs = config.SESSION_ABSOLUTE_HOURS * 3_600_000;
  return (req, _res, next) => {
    const started = req.session?.startedAt;
    if (started && Date.now() - started > limitMs) {
      req.session.destroy(() => next());
      return;
    }
    next();
  };
}

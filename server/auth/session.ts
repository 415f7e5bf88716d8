import session from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import { LRUCache } from 'lru-cache';
import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config';
import { readSession, takeSessionRequest, withSessionRequest } from './session-user';

export const SESSION_COOKIE = 'tt.sid';

/**
 * Sessions live in MariaDB, so they survive a restart and every app instance behind a load
 * balancer sees the same ones. `rolling` renews the idle deadline on each response; the
 * absolute deadline is enforced by `absoluteSessionLimit` below.
 */
export function sessionMiddleware(
  sequelize: Sequelize,
  config: Config,
): { middleware: RequestHandler; close: () => void } {
  const SequelizeStore = connectSessionSequelize(session.Store);
  const store = new SequelizeStore({
    db: sequelize,
    table: 'Session',
    checkExpirationInterval: 15 * 60 * 1000,
    // Recording the user id lets deactivation and a password change end that person's sessions;
    // address and browser let the person recognise each of their sessions.
    extendDefaultFields: (
      defaults: { data: string; expires: Date },
      s: { passport?: { user?: number }; clientIp?: string; userAgent?: string },
    ) => ({
      data: defaults.data,
      expires: defaults.expires,
      userId: s.passport?.user ?? null,
      ip: s.clientIp?.slice(0, 100) ?? null,
      userAgent: s.userAgent?.slice(0, 400) ?? null,
    }),
  });
  // The package's get() ignores `expires` until its sweep runs, so a replayed cookie would outlive
  // the idle limit (and `rolling` would then renew it). Only rows still in date count; the same
  // statement reads the person the session names (session-user.ts).
  const storedExpiry = new LRUCache<string, number>({ max: 10_000 });
  store.get = (sid, callback) => {
    readSession(sequelize, sid, takeSessionRequest())
      .then((row) => {
        if (row?.expires) storedExpiry.set(sid, row.expires.getTime());
        return row?.data ? JSON.parse(row.data) : null;
      })
      .then((data) => callback(null, data), callback);
  };
  // `rolling` renews the row's deadline after every answer: a write (and a log flush) behind every read. The row
  // is renewed only once it lags the new deadline by a tenth of the idle limit (at most a minute), so a session
  // can end up to that much sooner than its cookie says, never later. The expiry compared is the one this very
  // request read above, so it holds across app instances.
  const touchStepMs = Math.min(60_000, (config.SESSION_IDLE_MINUTES * 60_000) / 10);
  const touch = store.touch.bind(store);
  store.touch = (sid, data, callback) => {
    const next = data.cookie.expires ? new Date(data.cookie.expires).getTime() : undefined;
    const stored = storedExpiry.get(sid);
    if (next !== undefined && stored !== undefined && next - stored < touchStepMs) return callback?.(null);
    if (next !== undefined) storedExpiry.set(sid, next);
    return touch(sid, data, callback);
  };
  const middleware = session({
    name: SESSION_COOKIE,
    secret: config.SESSION_SECRET,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: config.TLS,
    cookie: { httpOnly: true, sameSite: 'lax', secure: config.TLS, maxAge: config.SESSION_IDLE_MINUTES * 60_000 },
  });
  // The store sweeps expired rows on a timer of its own; closing the app stops it.
  return { middleware: withSessionRequest(middleware), close: () => store.stopExpiringSessions() };
}

export function absoluteSessionLimit(config: Config): RequestHandler {
  const limitMs = config.SESSION_ABSOLUTE_HOURS * 3_600_000;
  return (req, _res, next) => {
    const started = req.session?.startedAt;
    if (started && Date.now() - started > limitMs) {
      // regenerate, not destroy: passport and the CSRF check need a (fresh, empty) session to follow.
      req.session.regenerate((err) => next(err));
      return;
    }
    next();
  };
}

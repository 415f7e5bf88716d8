import type { Express, Request, RequestHandler, Response } from 'express';
import { Passport } from 'passport';

export type AppPassport = InstanceType<typeof Passport>;
import { Strategy as LocalStrategy } from 'passport-local';
import { User, UserRole } from '../db/models';
import { verifyPassword, burnPasswordCheck } from './password';
import { toSessionUser } from '../users/user-dto';
import type { SessionUser } from '../../shared/schemas/auth.schema';
import { userReadWithSession } from './session-user';

/**
 * A passport instance per app (not the module singleton), so tests can build several apps.
 * Only the user id goes into the session; roles are read fresh on every request (with the session
 * row, session-user.ts), so a role change or deactivation takes effect at once.
 */
export function createPassport(): AppPassport {
  const passport = new Passport();
  passport.use(
    new LocalStrategy(async (username, password, done) => {
      try {
        const user = await User.scope('withPassword').findOne({
          where: { username: username.trim().toLowerCase() },
          include: [{ model: UserRole, as: 'roleRows' }],
        });
        if (!user) {
          await burnPasswordCheck(password);
          return done(null, false);
        }
        const ok = await verifyPassword(user.passwordHash, password);
        if (!ok || !user.active) return done(null, false, { message: user.active ? 'password' : 'inactive' });
        return done(null, toSessionUser(user));
      } catch (err) {
        return done(err);
      }
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  return passport;
}

/** The person a session names, as they are now: read with the session row (session-user.ts), else from `users`. */
async function userOfSession(req: Request, id: number): Promise<SessionUser | false> {
  const read = userReadWithSession(req, id);
  if (read !== undefined) return read;
  const user = await User.findByPk(id, { include: [{ model: UserRole, as: 'roleRows' }] });
  return user && user.active ? toSessionUser(user) : false;
}

/**
 * Gives every request of `app` passport's `login` and `logout`, which sign-in and sign-out use. Passport's
 * `initialize()` middleware sets them (and its session manager) on each request as it arrives; they are the same
 * functions every time, so they are set once here on the app's request prototype (Express 5 makes `app.request`
 * the prototype of each of its requests): seven properties added to every request object were a few per cent of a
 * small answer's allocations.
 */
export function installSignInMethods(app: Express, passport: AppPassport): void {
  const methods = {} as Request;
  passport.initialize({ compat: false })(methods, {} as Response, () => undefined);
  Object.assign(app.request, methods);
}

/**
 * Puts the signed-in person on `req.user` on every API request, as passport's session strategy would: the session
 * names a person by id; someone since deactivated (or deleted) is dropped from the session, so the request goes on
 * signed out. Passport's own `session()` runs its whole `authenticate` machinery for this on every request (a
 * strategy object and a handful of closures each time), several per cent of a small answer's CPU; this is the same
 * step without it.
 */
export const sessionPerson: RequestHandler = (req, _res, next) => {
  const named = req.session?.passport;
  if (!named || named.user === undefined || named.user === null) return next();
  userOfSession(req, named.user).then((user) => {
    if (user) req.user = user;
    else delete named.user;
    next();
  }, next);
};

import type { Request } from 'express';
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
  passport.deserializeUser(
    async (req: Request, id: number, done: (err: unknown, user?: SessionUser | false) => void) => {
      const read = userReadWithSession(req, id);
      if (read !== undefined) return done(null, read);
      try {
        const user = await User.findByPk(id, { include: [{ model: UserRole, as: 'roleRows' }] });
        done(null, user && user.active ? toSessionUser(user) : false);
      } catch (err) {
        done(err);
      }
    },
  );
  return passport;
}

import type { AppAbility } from '../shared/authz/app-ability';
import type { SessionUser } from '../shared/schemas/auth.schema';

declare global {
  namespace Express {
    // The signed-in person as passport restores them from the session.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
    interface Request {
      ability: AppAbility;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    startedAt: number;
    csrfToken: string;
    /** A one-time-code secret shown to the user but not yet confirmed by a matching code. */
    pendingTotp: string;
    /** Where the session signed in from, shown on the person's list of sessions. */
    clientIp: string;
    userAgent: string;
    /** Whom the session signed in: passport writes the person's id at sign-in (server/auth/passport.ts). */
    passport: { user?: number };
  }
}

export {};

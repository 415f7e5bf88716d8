import type { Request, RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import { plainSelect } from '../db/plain-query';
import type { SessionUser } from '../../shared/schemas/auth.schema';
import type { Role } from '../../shared/authz/roles';

/**
 * Every signed-in request used to read its session row, then its person and their roles: two round trips before
 * any work. `readSession` reads both in one statement, and the person it found waits on the request for the step
 * that signs the request in (`sessionPerson` in passport.ts), so roles and deactivation still take effect on the
 * next request.
 *
 * The store's get is not handed the request. express-session's middleware calls it synchronously, before anything
 * is awaited, so the request is left in `reading` for the length of that call and the get takes it on its first
 * line. A get outside that call (a session reload) finds none, and that step reads the person itself, as it would
 * anyway. (An AsyncLocalStorage would carry the request too, but it would switch Node's async context tracking on
 * for every request: see SERVER_TIMING_PHASES in config.ts.)
 */
let reading: Request | undefined;
// The person read with this request's own session row (false: the row names nobody, or someone inactive).
const readWithSession = new WeakMap<Request, { id: number | null; user: SessionUser | false }>();

interface Row {
  data: string | null;
  expires: Date | string | null;
  id: number | null;
  username: string | null;
  display_name: string | null;
  email: string | null;
  active: number | boolean | null;
  roles: string | null;
}

/** Runs express-session's middleware with the request at hand, so the store's get can leave the person on it. */
export function withSessionRequest(middleware: RequestHandler): RequestHandler {
  return (req, res, next) => {
    reading = req;
    try {
      middleware(req, res, next);
    } finally {
      reading = undefined;
    }
  };
}

/** The request whose session is being read, taken once: called on the store's get's first line. */
export function takeSessionRequest(): Request | undefined {
  const req = reading;
  reading = undefined;
  return req;
}

/** The session row still in date, with its person and their roles, in one statement. */
export async function readSession(
  sequelize: Sequelize,
  sid: string,
  req: Request | undefined,
): Promise<{ data: string | null; expires: Date | null } | null> {
  const [row] = await plainSelect<Row>(
    sequelize,
    `SELECT s.data, s.expires, u.id, u.username, u.display_name, u.email, u.active,
       (SELECT GROUP_CONCAT(r.role) FROM user_roles r WHERE r.user_id = u.id) AS roles
     FROM sessions s LEFT JOIN users u ON u.id = s.user_id WHERE s.sid = ? AND s.expires > ?`,
    [sid, new Date()],
  );
  if (req && row) {
    const user: SessionUser | false =
      row.id != null && row.active
        ? {
            id: row.id,
            username: row.username!,
            displayName: row.display_name!,
            email: row.email!,
            // Sorted as the model's `roles` sorts them.
            roles: (row.roles ? (row.roles.split(',') as Role[]) : []).sort(),
          }
        : false;
    readWithSession.set(req, { id: row.id, user });
  }
  if (!row) return null;
  return { data: row.data, expires: row.expires == null ? null : new Date(row.expires) };
}

/** The person read with this request's session row, if it is the one the session names; undefined: read them. */
export function userReadWithSession(req: Request, id: number): SessionUser | false | undefined {
  const found = readWithSession.get(req);
  readWithSession.delete(req);
  return found && found.id === id ? found.user : undefined;
}

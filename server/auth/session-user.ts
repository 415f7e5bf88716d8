import { AsyncLocalStorage } from 'node:async_hooks';
import type { Request, RequestHandler } from 'express';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { SessionUser } from '../../shared/schemas/auth.schema';
import type { Role } from '../../shared/authz/roles';

/**
 * Every signed-in request used to read its session row, then its person and their roles: two round trips before
 * any work. `readSession` reads both in one statement, and the person it found waits on the request for
 * passport's deserializer (`userReadWithSession`), so roles and deactivation still take effect on the next request.
 */
const requests = new AsyncLocalStorage<Request>();
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
  return (req, res, next) => requests.run(req, () => middleware(req, res, next));
}

/** The session row still in date, with its person and their roles, in one statement. */
export async function readSession(
  sequelize: Sequelize,
  sid: string,
): Promise<{ data: string | null; expires: Date | null } | null> {
  const [row] = await sequelize.query<Row>(
    `SELECT s.data, s.expires, u.id, u.username, u.display_name, u.email, u.active,
       (SELECT GROUP_CONCAT(r.role) FROM user_roles r WHERE r.user_id = u.id) AS roles
     FROM sessions s LEFT JOIN users u ON u.id = s.user_id WHERE s.sid = ? AND s.expires > ?`,
    { replacements: [sid, new Date()], type: QueryTypes.SELECT },
  );
  const req = requests.getStore();
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

import { z } from 'zod';

/** One of the signed-in person's sessions, as their account page lists it. */
export interface ActiveSessionDto {
  /** A digest of the session id: enough to name the session, useless as a cookie. */
  id: string;
  startedAt: string;
  lastSeenAt: string;
  ip: string | null;
  userAgent: string | null;
  /** The session this request came from. */
  current: boolean;
}

export const sessionIdParamsSchema = z.object({
  id: z.string().regex(/^[0-9a-f]{32}$/, 'is not a session id'),
});

const iso = z.string().min(1);
export const activeSessionsSchema = z.array(
  z.object({
    id: z.string(),
    startedAt: iso,
    lastSeenAt: iso,
    ip: z.string().nullable(),
    userAgent: z.string().nullable(),
    current: z.boolean(),
  }),
);

import { z } from 'zod';
import type { Role } from '../authz/roles';

export const GRANT_STATUSES = ['pending', 'confirmed', 'refused', 'withdrawn'] as const;
export type GrantStatus = (typeof GRANT_STATUSES)[number];

/** A signing role asked for someone, waiting for (or decided by) a second person. */
export interface RoleGrantDto {
  id: number;
  user: { id: number; name: string; username: string };
  role: Role;
  status: GrantStatus;
  requestedBy: { id: number; name: string };
  requestedAt: string;
  decidedBy: { id: number; name: string } | null;
  decidedAt: string | null;
}

/** Confirming takes the second person's password, like confirming a standard's version. */
export const confirmGrantSchema = z
  .object({
    password: z.string({ error: 'is required' }).min(1, 'is required').max(256, 'is at most 256 characters'),
  })
  .strict();

export const refuseGrantSchema = z
  .object({
    reason: z
      .string({ error: 'is required' })
      .trim()
      .min(3, 'must be at least 3 characters')
      .max(500, 'is at most 500 characters'),
  })
  .strict();

const person = z.object({ id: z.number(), name: z.string() });
export const roleGrantListSchema = z.array(
  z.object({
    id: z.number(),
    user: person.extend({ username: z.string() }),
    role: z.string(),
    status: z.enum(GRANT_STATUSES),
    requestedBy: person,
    requestedAt: z.string(),
    decidedBy: person.nullable(),
    decidedAt: z.string().nullable(),
  }),
);

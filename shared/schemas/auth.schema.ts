import { z } from 'zod';
import { ROLES } from '../authz/roles';

export const loginSchema = z.object({
  username: z.string({ error: 'is required' }).trim().min(1, 'is required').max(64, 'is at most 64 characters'),
  password: z.string({ error: 'is required' }).min(1, 'is required').max(256, 'is at most 256 characters'),
});
export type LoginRequest = z.infer<typeof loginSchema>;

/** Password policy: length over complexity rules (NIST SP 800-63B). */
export const newPasswordSchema = z
  .string({ error: 'is required' })
  .min(12, 'must be at least 12 characters')
  .max(256, 'is at most 256 characters');

export const changePasswordSchema = z.object({
  currentPassword: z.string({ error: 'is required' }).min(1, 'is required'),
  newPassword: newPasswordSchema,
});

export const roleSchema = z.enum(ROLES, { error: `must be one of ${ROLES.join(', ')}` });

/** The signed-in person as the client sees them. */
export interface SessionUser {
  id: number;
  username: string;
  displayName: string;
  email: string;
  roles: z.infer<typeof roleSchema>[];
}

import { z } from 'zod';
import { newPasswordSchema, roleSchema } from './auth.schema';

const username = z
  .string({ error: 'is required' })
  .trim()
  .min(3, 'must be at least 3 characters')
  .max(64, 'is at most 64 characters')
  .regex(
    /^[a-z0-9][a-z0-9._-]*$/,
    'may use lower-case letters, digits, dot, dash and underscore, starting with a letter or digit',
  );
const displayName = z
  .string({ error: 'is required' })
  .trim()
  .min(2, 'must be at least 2 characters')
  .max(120, 'is at most 120 characters');
const email = z.email({ error: 'must be an e-mail address' }).max(190, 'is at most 190 characters');
const roles = z
  .array(roleSchema)
  .min(1, 'needs at least one role')
  .max(5)
  .refine((r) => new Set(r).size === r.length, 'lists a role twice');

export const createUserSchema = z
  .object({
    username,
    displayName,
    email,
    roles,
    // The admin sets a first password that the person changes; admins never see it again.
    initialPassword: newPasswordSchema,
  })
  .strict();
export type CreateUserRequest = z.infer<typeof createUserSchema>;

export const updateUserSchema = z
  .object({
    displayName,
    email,
    roles,
    secondFactorRequired: z.boolean({ error: 'must be true or false' }),
    version: z.number().int().min(0),
  })
  .partial({ displayName: true, email: true, roles: true, secondFactorRequired: true })
  .strict();
export type UpdateUserRequest = z.infer<typeof updateUserSchema>;

export interface UserDto {
  id: number;
  username: string;
  displayName: string;
  email: string;
  roles: z.infer<typeof roleSchema>[];
  /** Signing roles asked for this person, waiting for a second person's confirmation. */
  pendingRoles: z.infer<typeof roleSchema>[];
  active: boolean;
  /** An administrator requires a one-time code from this person when they sign. */
  secondFactorRequired: boolean;
  lastSignInAt: string | null;
  createdAt: string;
  version: number;
}

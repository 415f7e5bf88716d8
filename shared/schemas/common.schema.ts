import { z } from 'zod';

/** A numeric route parameter such as `/api/users/:id`; anything else is a 400, not a lookup. */
export const idParamsSchema = z.object({
  id: z.coerce.number({ error: 'must be a number' }).int('must be a whole number').positive('must be positive'),
});

export const pageQuerySchema = z.object({
  page: z.coerce.number().int().min(0).default(0),
  size: z.coerce.number().int().min(1).max(200).default(50),
  q: z.string().trim().max(100).optional(),
});
export type PageQuery = z.infer<typeof pageQuerySchema>;

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  size: number;
}

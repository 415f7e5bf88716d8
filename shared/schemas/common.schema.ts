import { z } from 'zod';

/**
 * The one parser of record ids in paths and queries: decimal digits only. `Number()` would read
 * `0x10` as 16, `1e3` as 1000 and ` 7` as 7, so the same record would answer to many addresses.
 */
export const decimalId = (what = 'a record id') => z.string({ error: `must be ${what} in decimal digits` })
  .regex(/^[1-9][0-9]{0,14}$/, `must be ${what} in decimal digits`).transform(Number);

/** A numeric route parameter such as `/api/users/:id`; anything else is a 400, not a lookup. */
export const idParamsSchema = z.object({ id: decimalId() });

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

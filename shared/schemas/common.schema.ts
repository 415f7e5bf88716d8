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

/** An opaque keyset cursor: where the next page starts (the sort values and id of the last row shown). */
export const cursorSchema = z.string().max(600, 'is not a page cursor').regex(/^[A-Za-z0-9_-]+$/, 'is not a page cursor').optional();

/**
 * A page read by keyset: `after` the last row of the previous page, so page 2,000 costs what page
 * 1 costs. The total is counted once per filter (on the first page, `total` is null on later ones)
 * and only up to a cap: `totalIsAtLeast` says the real number is larger than `total`.
 */
export interface KeysetPage<T> {
  items: T[];
  size: number;
  next: string | null;
  total: number | null;
  totalIsAtLeast: boolean;
}

import { z } from 'zod';
import { jsonValueProblem } from '../json/json-value-check';

/**
 * The one parser of record ids in paths and queries: decimal digits only. `Number()` would read
 * `0x10` as 16, `1e3` as 1000 and ` 7` as 7, so the same record would answer to many addresses.
 */
export const decimalId = (what = 'a number') =>
  z
    .string({ error: `must be ${what}` })
    .regex(/^[1-9][0-9]{0,14}$/, `must be ${what}`)
    .transform(Number);

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

/**
 * A JSON document stored as the user sent it (a draft calc input, a standard's text): an object
 * of at most `maxKb` kB and `maxDepth` levels, with no value JSON cannot hold. The request edge
 * applies looser limits to every body; these are the document's own, named at the field.
 */
export const jsonDocumentSchema = (maxKb: number, maxDepth: number) =>
  z.record(z.string(), z.unknown(), { error: 'must be a JSON object' }).superRefine((doc, ctx) => {
    const problem = jsonValueProblem(doc, { maxDepth, maxNodes: 100_000 });
    if (problem) ctx.addIssue({ code: 'custom', message: problem.message, path: problem.parts });
    else if (JSON.stringify(doc).length > maxKb * 1024)
      ctx.addIssue({ code: 'custom', message: `is larger than ${maxKb} kB` });
  });

/** An opaque keyset cursor: where the next page starts (the sort values and id of the last row shown). */
export const cursorSchema = z
  .string()
  .max(600, 'is not a page cursor')
  .regex(/^[A-Za-z0-9_-]+$/, 'is not a page cursor')
  .optional();

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

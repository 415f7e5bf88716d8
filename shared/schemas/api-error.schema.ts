import { z } from 'zod';

/** Field-level problems, keyed by the field path as the screen names it (e.g. `code`, `roles[0]`). */
export const fieldErrorsSchema = z.record(z.string(), z.array(z.string()));
export type FieldErrors = z.infer<typeof fieldErrorsSchema>;

/**
 * The body of every failed API answer: what the server's error middleware sends and what the
 * client's error interceptor parses. Extra details (e.g. `retryAfterSeconds`) may ride along.
 */
export const apiErrorBodySchema = z.looseObject({
  code: z.string(),
  message: z.string(),
  fieldErrors: fieldErrorsSchema.optional(),
});
export type ApiErrorBody = z.infer<typeof apiErrorBodySchema>;

/** A failed call as the client holds it: the body plus the HTTP status (0 when the server was not reached). */
export interface ApiError {
  status: number;
  code: string;
  message: string;
  fieldErrors: FieldErrors;
}

import { fieldLabel } from '../../shared/engine/field-places';
import type { FieldErrors } from '../../shared/schemas/api-error.schema';

export type { FieldErrors };

/**
 * The one error type services throw on purpose. `expose` says the message is safe to show;
 * anything that is not an AppError is treated as a bug and answered with a generic 500.
 */
export class AppError extends Error {
  constructor(
    readonly code: string,
    readonly status: number,
    message: string,
    readonly details?: { fieldErrors?: FieldErrors; [extra: string]: unknown },
    readonly expose = status < 500,
    options?: { cause?: unknown },
  ) {
    super(message, options);
    this.name = 'AppError';
  }

  static validation(fieldErrors: FieldErrors): AppError {
    const first = Object.entries(fieldErrors)[0];
    const summary = first ? `${fieldLabel(first[0])}: ${first[1][0]}` : 'invalid request';
    return new AppError('validation', 400, `Invalid input — ${summary}`, { fieldErrors });
  }

  static notFound(what: string): AppError {
    return new AppError('not_found', 404, `${what} was not found`);
  }

  static conflict(message: string): AppError {
    return new AppError('conflict', 409, message);
  }
}

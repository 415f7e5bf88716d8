import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ForbiddenError } from '@casl/ability';
import { UniqueConstraintError, ValidationError, OptimisticLockError } from 'sequelize';
import { AppError } from './app-error';
import type { ApiErrorBody } from '../../shared/schemas/api-error.schema';
import { logger } from '../logger';
import { addFieldError } from '../http/validate';
import { classifyDbError } from '../db/db-errors';
import { unavailable } from '../db/transaction';

/** JSON 404 for unknown API routes, so clients never receive the app's HTML for a typo. */
export const apiNotFound: RequestHandler = (req, res) => {
  res
    .status(404)
    .json({ code: 'not_found', message: `No API route ${req.method} ${req.originalUrl}` } satisfies ApiErrorBody);
};

function toAppError(err: unknown): AppError | undefined {
  if (err instanceof AppError) return err;
  if (err instanceof ForbiddenError) {
    return new AppError('forbidden', 403, err.message || 'You are not allowed to do this');
  }
  if (err instanceof UniqueConstraintError) {
    const fields = Object.keys(err.fields ?? {});
    const fieldErrors = Object.fromEntries(fields.map((f) => [f, ['is already taken']]));
    return new AppError('conflict', 409, `${fields.join(', ') || 'value'} is already taken`, { fieldErrors });
  }
  if (err instanceof OptimisticLockError) {
    return AppError.conflict('Someone else changed this record; reload to see their version');
  }
  if (err instanceof ValidationError) {
    const fieldErrors: Record<string, string[]> = {};
    for (const item of err.errors) addFieldError(fieldErrors, item.path ?? 'record', item.message);
    return AppError.validation(fieldErrors);
  }
  // The router cannot percent-decode a path such as /%c0%ae: the path, not the server, is at fault.
  if (err instanceof URIError) {
    return new AppError('bad_path', 400, 'The address is not valid: it holds a bad percent-encoding', {
      fieldErrors: { path: ['has a bad percent-encoding'] },
    });
  }
  // A database that deadlocked, timed out or is changing over (outside a retried transaction, e.g.
  // a read or the session store) is a clean 503 the client may retry, never a 500.
  if (classifyDbError(err)) return unavailable(err);
  // body-parser marks malformed JSON and oversized bodies with a status and `expose`.
  const e = err as { status?: number; expose?: boolean; type?: string; code?: string; message?: string };
  if (e && typeof e.status === 'number' && e.status < 500 && e.expose) {
    const message = e.type === 'entity.parse.failed' ? 'Request body is not valid JSON' : (e.message ?? 'Bad request');
    return new AppError(e.code ?? e.type ?? 'bad_request', e.status, message);
  }
  return undefined;
}

export const errorHandler: ErrorRequestHandler = (err, req, res, next) => {
  if (res.headersSent) return next(err);
  const known = toAppError(err);
  if (known) {
    if (known.status === 503) res.set('Retry-After', String(known.details?.retryAfterSeconds ?? 1));
    res
      .status(known.status)
      .json({ code: known.code, message: known.message, ...known.details } satisfies ApiErrorBody);
    return;
  }
  logger.error({ err, method: req.method, url: req.originalUrl }, 'unhandled error');
  res.status(500).json({
    code: 'internal',
    message: 'Something went wrong on the server; it has been logged.',
  } satisfies ApiErrorBody);
};

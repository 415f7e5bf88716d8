import multer from 'multer';
import type { RequestHandler } from 'express';
import { AppError } from '../errors/app-error';

/**
 * Reads one multipart file into memory with a hard size limit. Multer's own errors become
 * AppErrors naming the field and the reason, so an oversized or odd upload is a clear 4xx.
 */
export function singleUpload(field: string, maxBytes: number): RequestHandler {
  const parse = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 8, fieldSize: 4000, parts: 10 },
    // Browsers send UTF-8 file names; multer's default would read them as Latin-1.
    defParamCharset: 'utf8',
  }).single(field);
  return (req, res, next) => {
    parse(req, res, (err: unknown) => next(err instanceof multer.MulterError ? toAppError(err, field, maxBytes) : err && unreadable(err, field)));
  };
}

/**
 * Memory storage does no I/O of its own, so any other error comes from reading the body: busboy's
 * "Malformed part header", "Unexpected end of form", a wrong boundary, a client that went away.
 */
function unreadable(err: unknown, field: string): AppError {
  const reason = err instanceof Error ? err.message : String(err);
  return new AppError('validation', 400, `${field}: the upload is not a readable multipart form (${reason}); nothing was stored`,
    { fieldErrors: { [field]: [`is not a readable multipart upload (${reason})`] } });
}

function toAppError(err: multer.MulterError, field: string, maxBytes: number): AppError {
  const limit = maxBytes >= 1024 * 1024 ? `${+(maxBytes / 1024 / 1024).toFixed(1)} MB` : `${Math.round(maxBytes / 1024)} kB`;
  switch (err.code) {
    case 'LIMIT_FILE_SIZE':
      return new AppError('too_large', 413, `${field}: is larger than the ${limit} limit; nothing was stored`, { fieldErrors: { [field]: [`is larger than the ${limit} limit`] } });
    case 'LIMIT_UNEXPECTED_FILE':
      return AppError.validation({ [err.field ?? 'file']: [`is not expected here; send one file as form field "${field}"`] });
    default:
      return AppError.validation({ [err.field ?? field]: [err.message] });
  }
}

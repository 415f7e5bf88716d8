import multer from 'multer';
import type { Request, RequestHandler } from 'express';
import { AppError } from '../errors/app-error';

/**
 * Reads one multipart file into memory with a hard size limit. Multer's own errors become
 * AppErrors naming the field and the reason, so an oversized or odd upload is a clear 4xx.
 */
export function singleUpload(field: string, maxBytes: number): RequestHandler {
  // multer passes defCharset on to busboy; its type definitions lag behind.
  const options: multer.Options & { defCharset: string } = {
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 8, fieldSize: 4000, parts: 10 },
    // Read as Latin-1 (one character per byte) and decoded strictly as UTF-8 below: a UTF-8 reading
    // here would silently turn invalid bytes into U+FFFD, storing text the sender never wrote.
    defParamCharset: 'latin1',
    defCharset: 'latin1',
  };
  const parse = multer(options).single(field);
  return (req, res, next) => {
    parse(req, res, (err: unknown) => {
      if (err)
        return next(err instanceof multer.MulterError ? toAppError(err, field, maxBytes) : unreadable(err, field));
      next(strictText(req, field));
    });
  };
}

const utf8 = new TextDecoder('utf-8', { fatal: true });

/** Re-reads the Latin-1 texts as UTF-8, refusing (never altering) bytes that are not UTF-8. */
function strictText(req: Request, field: string): AppError | undefined {
  const decode = (text: string, name: string): string => {
    try {
      return utf8.decode(Buffer.from(text, 'latin1'));
    } catch {
      throw AppError.validation({ [name]: ['is not valid UTF-8 text; nothing was stored'] });
    }
  };
  try {
    if (req.file) req.file.originalname = decode(req.file.originalname, field);
    const body = (req.body ?? {}) as Record<string, unknown>;
    for (const [name, value] of Object.entries(body)) {
      if (typeof value === 'string') body[name] = decode(value, name);
      else if (Array.isArray(value)) body[name] = value.map((v) => (typeof v === 'string' ? decode(v, name) : v));
    }
    return undefined;
  } catch (err) {
    return err as AppError;
  }
}

/**
 * Memory storage does no I/O of its own, so any other error comes from reading the body: busboy's
 * "Malformed part header", "Unexpected end of form", a wrong boundary, a client that went away.
 */
function unreadable(err: unknown, field: string): AppError {
  const reason = err instanceof Error ? err.message : String(err);
  return new AppError(
    'validation',
    400,
    `${field}: the upload is not a readable multipart form (${reason}); nothing was stored`,
    { fieldErrors: { [field]: [`is not a readable multipart upload (${reason})`] } },
  );
}

function toAppError(err: multer.MulterError, field: string, maxBytes: number): AppError {
  const limit =
    maxBytes >= 1024 * 1024 ? `${+(maxBytes / 1024 / 1024).toFixed(1)} MB` : `${Math.round(maxBytes / 1024)} kB`;
  switch (err.code) {
    case 'LIMIT_FILE_SIZE':
      return new AppError('too_large', 413, `${field}: is larger than the ${limit} limit; nothing was stored`, {
        fieldErrors: { [field]: [`is larger than the ${limit} limit`] },
      });
    case 'LIMIT_UNEXPECTED_FILE':
      return AppError.validation({
        [err.field ?? 'file']: [`is not expected here; send one file as form field "${field}"`],
      });
    default:
      return AppError.validation({ [err.field ?? field]: [err.message] });
  }
}

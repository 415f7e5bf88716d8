import express, { type RequestHandler } from 'express';
import { parseStrictJson, ROOT_PATH } from '../../shared/json/strict-json';
import { AppError } from '../errors/app-error';

const JSON_TYPES = ['application/json', 'application/*+json'];
const utf8 = new TextDecoder('utf-8', { fatal: true });

function decode(bytes: Buffer, charset: string | undefined): string {
  if (charset && charset.toLowerCase() !== 'utf-8' && charset.toLowerCase() !== 'utf8') {
    throw new AppError('unsupported_charset', 415, `Request body must be UTF-8, not ${charset}`);
  }
  try {
    return utf8.decode(bytes);
  } catch {
    // Replacing bad bytes would store text the sender never wrote.
    throw AppError.validation({ '': ['is not valid UTF-8 text; nothing was changed'] });
  }
}

/**
 * express.json's replacement: the raw body (size-limited by body-parser, 413 past `limit`) is
 * decoded as strict UTF-8 and parsed by shared/json/strict-json, so non-finite numbers, prototype
 * keys, lone surrogates, duplicate keys and deep nesting are a 400 naming the field, before any
 * handler or schema sees the value. Like express.json, an empty body is `{}` and the top level
 * must be an object or an array.
 */
export function jsonBody(limit: string): RequestHandler[] {
  const raw = express.raw({ type: JSON_TYPES, limit });
  const parse: RequestHandler = (req, _res, next) => {
    if (!Buffer.isBuffer(req.body)) return next();
    const charset = /;\s*charset=["']?([^;"'\s]+)/i.exec(req.headers['content-type'] ?? '')?.[1];
    const text = decode(req.body, charset);
    if (text.trim() === '') {
      req.body = {};
      return next();
    }
    if (!/^\s*[[{]/.test(text)) throw new AppError('entity.parse.failed', 400, 'Request body is not valid JSON');
    const parsed = parseStrictJson(text);
    if (parsed.ok) {
      req.body = parsed.value;
      return next();
    }
    if (parsed.issue.message.startsWith('not valid JSON'))
      throw new AppError('entity.parse.failed', 400, 'Request body is not valid JSON');
    // Field errors name the body's own fields; the body as a whole is the empty path, as in validate.ts.
    throw AppError.validation({ [parsed.issue.path === ROOT_PATH ? '' : parsed.issue.path]: [parsed.issue.message] });
  };
  return [raw, parse];
}

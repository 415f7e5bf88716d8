import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { AppError, type FieldErrors } from '../errors/app-error';

type Part = 'body' | 'params' | 'query';
type Schemas = Partial<Record<Part, z.ZodType>>;

function pathOf(path: readonly PropertyKey[], prefix: string): string {
  return path.reduce<string>(
    (acc, key) => (typeof key === 'number' ? `${acc}[${key}]` : acc ? `${acc}.${String(key)}` : String(key)),
    prefix,
  );
}

/**
 * Adds a message under a path the client chose (a key such as `__proto__` or `constructor` is an
 * own property here, never a lookup on Object.prototype).
 */
export function addFieldError(out: FieldErrors, path: string, message: string): void {
  if (Object.hasOwn(out, path)) out[path].push(message);
  else Object.defineProperty(out, path, { value: [message], enumerable: true, writable: true, configurable: true });
}

export function zodFieldErrors(error: z.ZodError, prefix = '', out: FieldErrors = {}): FieldErrors {
  for (const issue of error.issues) {
    // A strict schema reports unknown fields as one issue on their parent; name each field instead.
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys)
        addFieldError(out, pathOf([...issue.path, key], prefix), 'is not an accepted field');
      continue;
    }
    addFieldError(out, pathOf(issue.path, prefix), issue.message);
  }
  return out;
}

/**
 * Validates request parts against the shared zod schemas and replaces them with the parsed
 * values (Express 5 makes `req.query` a getter, so the parsed query goes to `res.locals.query`).
 */
export function validate(schemas: Schemas): RequestHandler {
  return (req, res, next) => {
    const errors: FieldErrors = {};
    for (const part of Object.keys(schemas) as Part[]) {
      const result = schemas[part]!.safeParse(req[part] ?? {});
      if (!result.success) zodFieldErrors(result.error, part === 'body' ? '' : part, errors);
      else if (part === 'query') res.locals.query = result.data;
      else if (part === 'params') Object.assign(req.params, result.data);
      else req.body = result.data;
    }
    if (Object.keys(errors).length > 0) return next(AppError.validation(errors));
    next();
  };
}

import { Router, type Request } from 'express';
import { decimalId } from '../../shared/schemas/common.schema';
import { AppError } from '../errors/app-error';
import { zodFieldErrors } from './validate';

const ID = decimalId();
const parsed = new WeakMap<Request, Record<string, number>>();

/**
 * A router whose `:id` is parsed once, before validation and every handler of the route: a bad
 * id is a 400 naming `params.id`, so no route can forget the check or read `Number('abc')`.
 */
export function idRouter(): Router {
  const router = Router();
  router.param('id', (req, _res, next, value: string, name: string) => {
    const result = ID.safeParse(value);
    if (!result.success) return next(AppError.validation(zodFieldErrors(result.error, `params.${name}`)));
    parsed.set(req, { ...parsed.get(req), [name]: result.data });
    next();
  });
  return router;
}

/** The parsed `:id` of a route on an `idRouter()`. */
export function idParam(req: Request): number {
  const id = parsed.get(req)?.id;
  // Only a router built without idRouter() gets here: a programming error, not bad input.
  if (id === undefined) throw new Error(`${req.method} ${req.originalUrl}: :id was not parsed (use idRouter())`);
  return id;
}

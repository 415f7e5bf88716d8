import type { NextFunction, Request, RequestHandler, Response } from 'express';

/**
 * Several middleware functions as one, run in order, as `app.use(path, a, b, c)` would run them: an error (thrown,
 * passed to `next`, or a rejected promise, as Express 5 catches it) skips the rest and goes to the error handler.
 * Express's router does more for each layer it passes than these steps need (matching the path, trimming it from
 * `req.url` and putting it back, parsing the shortened address again), and every API request passes through all
 * of them; as one layer they are matched once. They must not call `next('route')` or `next('router')` (none does).
 */
export function inSequence(...handlers: RequestHandler[]): RequestHandler {
  return (req: Request, res: Response, done: NextFunction) => {
    let i = 0;
    const step = (err?: unknown): void => {
      if (err !== undefined && err !== null) return done(err);
      const handler = handlers[i++];
      if (!handler) return done();
      try {
        const returned = handler(req, res, step) as unknown;
        if (typeof (returned as Promise<unknown> | undefined)?.then === 'function') {
          (returned as Promise<unknown>).then(undefined, (e: unknown) => done(e ?? new Error('Rejected promise')));
        }
      } catch (e) {
        done(e);
      }
    };
    step();
  };
}

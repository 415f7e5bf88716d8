import type { RequestHandler } from 'express';

/**
 * A `Server-Timing: app;dur=…` header on every API answer: the browser's network panel then shows how
 * much of a slow screen is the server and how much the page itself, which is where speed work starts.
 */
export function serverTiming(): RequestHandler {
  return (_req, res, next) => {
    const start = process.hrtime.bigint();
    const writeHead = res.writeHead.bind(res) as (...args: unknown[]) => ReturnType<typeof res.writeHead>;
    res.writeHead = ((...args: unknown[]) => {
      if (!res.headersSent)
        res.setHeader('Server-Timing', `app;dur=${(Number(process.hrtime.bigint() - start) / 1e6).toFixed(1)}`);
      return writeHead(...args);
    }) as typeof res.writeHead;
    next();
  };
}

import { AsyncLocalStorage } from 'node:async_hooks';
import type { RequestHandler } from 'express';

// Milliseconds per named phase of the request being answered (summed when a phase runs more than once).
const phases = new AsyncLocalStorage<Map<string, number>>();

/**
 * A `Server-Timing` header on every API answer: `app` is the whole answer, then each phase that `timed` measured
 * (e.g. `read`, `hash`): the browser's network panel then shows how much of a slow screen is the server, and which
 * part of it, and how much the page itself, which is where speed work starts. The phases only with `withPhases`
 * (config SERVER_TIMING_PHASES, off by default): their store switches on Node's async context tracking.
 */
export function serverTiming(withPhases: boolean): RequestHandler {
  return (_req, res, next) => {
    const start = process.hrtime.bigint();
    const measured = new Map<string, number>();
    const writeHead = res.writeHead.bind(res) as (...args: unknown[]) => ReturnType<typeof res.writeHead>;
    res.writeHead = ((...args: unknown[]) => {
      if (!res.headersSent) {
        const app = `app;dur=${(Number(process.hrtime.bigint() - start) / 1e6).toFixed(1)}`;
        const parts = [...measured].map(([name, ms]) => `${name};dur=${ms.toFixed(1)}`);
        res.setHeader('Server-Timing', [app, ...parts].join(', '));
      }
      return writeHead(...args);
    }) as typeof res.writeHead;
    if (withPhases) phases.run(measured, next);
    else next();
  };
}

/** Runs `work` and adds its time to the current answer's Server-Timing under `name` (a token: letters, digits, -). */
export async function timed<T>(name: string, work: () => Promise<T> | T): Promise<T> {
  const measured = phases.getStore();
  if (!measured) return work();
  const start = process.hrtime.bigint();
  try {
    return await work();
  } finally {
    measured.set(name, (measured.get(name) ?? 0) + Number(process.hrtime.bigint() - start) / 1e6);
  }
}

/** Adds the time since `start` (process.hrtime.bigint()) to the current answer's Server-Timing under `name`. */
export function timeSince(name: string, start: bigint): void {
  const measured = phases.getStore();
  if (measured) measured.set(name, (measured.get(name) ?? 0) + Number(process.hrtime.bigint() - start) / 1e6);
}

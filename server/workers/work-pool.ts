import path from 'node:path';
import { Piscina } from 'piscina';
import { AppError } from '../errors/app-error';
import { logger } from '../logger';
import type { Outcome } from './heavy-work';

export interface WorkPoolLimits {
  /** Worker threads at most: how many packs or reports are worked on at once. */
  threads: number;
  /** Old-generation heap of each worker; a job that needs more ends that worker, not the server. */
  memoryMb: number;
  /** Jobs waiting for a thread before new ones are turned away with a 503. */
  queue: number;
}

/**
 * The pool of worker threads for heavy work (piscina). It bounds concurrency (threads), memory
 * (each worker's heap limit) and waiting (queue length), so four large evidence packs and four
 * reports at once leave the event loop free for everyone else's requests.
 * Each thread loads heavy-work.ts through tsx (heavy-work.entry.cjs). HEAVY_WORK_BUNDLE may name a prebuilt CommonJS
 * bundle of heavy-work.ts instead: the tests build one per run (test/support/bundle.ts), which saves tsx's compile
 * in every thread they start (DEVELOPERS.md, "Tests").
 */
export class WorkPool {
  private readonly pool: Piscina;

  constructor(limits: WorkPoolLimits) {
    this.pool = new Piscina({
      filename: process.env.HEAVY_WORK_BUNDLE || path.join(__dirname, 'heavy-work.entry.cjs'),
      minThreads: 0,
      maxThreads: limits.threads,
      maxQueue: limits.queue,
      idleTimeout: 30_000,
      resourceLimits: { maxOldGenerationSizeMb: limits.memoryMb, maxYoungGenerationSizeMb: 32 },
    });
  }

  async run<T>(
    name: 'verifyPackOffline' | 'renderReportPdf',
    input: unknown,
    transfer: ArrayBuffer[] = [],
  ): Promise<T> {
    let result: Outcome<T>;
    try {
      result = await this.pool.run(input, { name, transferList: transfer as never });
    } catch (err) {
      throw translate(err, name);
    }
    if (!result.ok)
      throw new AppError(result.error.code, result.error.status, result.error.message, result.error.details);
    return result.value;
  }

  /** Ends the worker threads (jobs still queued are refused); the server and each test app call it on the way out. */
  async close(): Promise<void> {
    await this.pool.close({ force: true });
    // piscina never reports its async resource as ended, so jest --detectOpenHandles would list a closed pool.
    this.pool.emitDestroy();
  }
}

function translate(err: unknown, name: string): Error {
  const message = err instanceof Error ? err.message : String(err);
  if (/queue is at limit/i.test(message)) {
    return new AppError('busy', 503, 'The server is busy with other packs and reports; try again in a minute');
  }
  if ((err as { code?: string })?.code === 'ERR_WORKER_OUT_OF_MEMORY') {
    logger.warn({ name }, 'a worker ran out of its memory limit');
    return new AppError(
      'too_large',
      413,
      'This needs more memory than one job may use; the file is too large to process here',
    );
  }
  return err instanceof Error ? err : new Error(message);
}

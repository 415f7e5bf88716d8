import cluster, { type Worker } from 'node:cluster';
import { CAUTION } from '../shared/engine';
import type { Config } from './config';
import { logger } from './logger';

/** What a listening app process tells its parent: the bench, the specs and this file's primary read it. */
export interface ReadyMessage {
  ready: true;
  port: number;
  /** The worker processes' ids when APP_PROCESSES > 1 (a spec kills one to see it replaced). */
  workers?: number[];
}

// A worker that dies this soon after starting is failing to start, not failing under load: wait before the next.
const QUICK_DEATH_MS = 5_000;
const RESTART_DELAY_MS = 1_000;

/**
 * `APP_PROCESSES` app processes sharing one port through node:cluster, so one machine's cores all answer
 * requests. Each worker is a whole app instance (pool, mail sender, caches): instances are stateless, as
 * the README's scaling section says, so they need nothing from each other. A worker that dies is replaced;
 * SIGTERM or SIGINT stops them all and then this process.
 */
export function runAppProcesses(config: Config): void {
  let stopping = false;
  let announced = false;
  // Tracked here: node:cluster may still list a worker in its 'exit' event (until its channel has closed too).
  const live = new Map<Worker, number>();
  const fork = () => live.set(cluster.fork(), Date.now());
  const pids = () => [...live.keys()].flatMap((w) => (w.process.pid ? [w.process.pid] : []));

  cluster.on('message', (worker: Worker, message: Partial<ReadyMessage>) => {
    if (!message.ready) return;
    if (announced) {
      // A replacement is listening: a parent that watches the processes hears of it.
      if (process.send) process.send({ workerReady: worker.process.pid, workers: pids() });
      return;
    }
    announced = true;
    announce(config, message.port ?? config.PORT, pids());
  });
  cluster.on('exit', (worker, code, signal) => {
    const lived = Date.now() - (live.get(worker) ?? 0);
    live.delete(worker);
    if (stopping) {
      if (live.size === 0) process.exit(exitCode);
      return;
    }
    if (!announced) {
      // None has listened yet: the configuration or the database is wrong, and another would fail the same way.
      logger.fatal({ pid: worker.process.pid, code, signal }, 'an app process failed to start; stopping');
      stop('SIGTERM', code || 1);
      return;
    }
    logger.error({ pid: worker.process.pid, code, signal }, 'an app process died; starting another');
    setTimeout(fork, lived < QUICK_DEATH_MS ? RESTART_DELAY_MS : 0);
  });
  let exitCode = 0;
  function stop(signal: NodeJS.Signals, code = 0) {
    if (stopping) return;
    stopping = true;
    exitCode = code;
    logger.info({ signal }, 'stopping the app processes');
    for (const worker of live.keys()) worker.process.kill('SIGTERM');
    if (live.size === 0) process.exit(exitCode);
  }
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
  for (let i = 0; i < config.APP_PROCESSES; i++) fork();
}

/** Says once that the app listens: on the terminal (with the caution) and to a parent process that waits for it. */
export function announce(config: Config, port: number, workers?: number[]): void {
  logger.info({ port, processes: workers?.length ?? 1 }, 'Torquetrail is listening');
  if (config.NODE_ENV !== 'test') {
    process.stdout.write(
      `\nTorquetrail is running at http://${config.HOST}:${port}/  (Ctrl-C stops it)\n` + `${CAUTION}\n\n`,
    );
  }
  const ready: ReadyMessage = { ready: true, port, ...(workers ? { workers } : {}) };
  if (process.send) process.send(ready);
}

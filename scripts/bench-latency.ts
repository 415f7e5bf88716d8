// Latency of a cheap request, sampled back to back, for the event-loop benchmark (bench-stall.ts).
import { performance } from 'node:perf_hooks';
import type request from 'supertest';
import { percentile } from './bench-health-timing';

/** "label: N requests · p50 … · p95 … · p99 … · max …" with tenths of a millisecond. */
export function latencySummary(label: string, samples: number[]): string {
  const f = (v: number) => `${v.toFixed(1)} ms`;
  const at = (q: number) => f(percentile(samples, q));
  return `  ${label}: ${samples.length} requests · p50 ${at(0.5)} · p95 ${at(0.95)} · p99 ${at(0.99)} · max ${at(1)}`;
}

/** Sequential GET /api/session until `until` settles (or for `until` ms); returns each request's latency. */
export async function sampleSession(agent: request.Agent, until: Promise<unknown> | number): Promise<number[]> {
  let done = false;
  if (typeof until === 'number')
    setTimeout(() => {
      done = true;
    }, until);
  else
    void until.finally(() => {
      done = true;
    });
  const times: number[] = [];
  while (!done) {
    const t = performance.now();
    await agent.get('/api/session').expect(200);
    times.push(performance.now() - t);
  }
  return times;
}

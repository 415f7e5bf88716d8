// Timing helpers of the review-health bench (bench-health.ts): one answer with its Server-Timing phases, the CPU time
// a process on this machine has used, and the percentiles of repeated answers. Nothing here asserts a figure.
import { readFileSync } from 'node:fs';

export interface Answer {
  ms: number;
  status: number;
  serverMs: number | null;
  bytes: number;
  phases: Map<string, number>;
}

export async function timed(url: string, cookie: string): Promise<Answer> {
  const t0 = performance.now();
  const res = await fetch(url, { headers: { cookie } });
  const text = await res.text();
  const body = JSON.parse(text) as { elapsedMs?: number };
  // Server-Timing: `name;dur=12.3` per phase of the answer (server/http/server-timing.ts).
  const phases = new Map(
    (res.headers.get('server-timing') ?? '')
      .split(',')
      .map((p) => p.trim().match(/^([\w-]+);dur=([\d.]+)$/))
      .filter((m) => m !== null)
      .map((m) => [m[1], Number(m[2])] as const),
  );
  return {
    ms: performance.now() - t0,
    status: res.status,
    serverMs: body.elapsedMs ?? null,
    bytes: text.length,
    phases,
  };
}

/**
 * CPU time a process has used (user + system, ms), steadier than wall time on a shared machine; null when the
 * process is not readable here (a database on another machine).
 */
export function cpuMs(pid: number | null): number | null {
  if (pid === null) return null;
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
    return ((Number(fields[11]) + Number(fields[12])) * 1000) / 100;
  } catch {
    return null;
  }
}

/** The process id MariaDB wrote to its pid file, when that file is on this machine. */
export function pidFromFile(path: string | null): number | null {
  if (!path) return null;
  try {
    return Number(readFileSync(path, 'utf8').trim()) || null;
  } catch {
    return null;
  }
}

/** CPU time per answer between two readings, in words ("—" when either reading is missing). */
export function cpuPer(before: number | null, after: number | null, answers: number): string {
  return before === null || after === null ? '—' : `${((after - before) / answers).toFixed(0)} ms`;
}

/** The nearest-rank percentile: the smallest value at least `q` of the values do not exceed. */
export function percentile(values: number[], q: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))];
}

/** "p50 12 ms, p95 30 ms, p99 41 ms, max 45 ms" of repeated answers. */
export function spread(values: number[]): string {
  const at = (q: number) => percentile(values, q).toFixed(0);
  return `p50 ${at(0.5)} ms, p95 ${at(0.95)} ms, p99 ${at(0.99)} ms, max ${at(1)} ms`;
}

/** The p50 of each Server-Timing phase over the answers (the phases run side by side). */
export function phaseMedians(runs: Answer[]): string {
  const names = [...runs[0].phases.keys()].filter((k) => k !== 'app');
  const p50 = (k: string) =>
    percentile(
      runs.map((r) => r.phases.get(k) ?? 0),
      0.5,
    ).toFixed(0);
  return names.map((k) => `${k} ${p50(k)}`).join(', ');
}

// Sizes, a seeded random generator, calc contents and batched inserts for the list benchmark.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Connection } from 'mariadb';
import type { RuleSet } from '../shared/rules';
import { computeRecord } from '../server/calcs/revision-content';
import { stored } from '../server/calcs/calcs.service';

const scale = Number(process.env.BENCH_SCALE ?? 1);
export const BENCH = {
  people: 200,
  projects: 50,
  calcs: Math.round(100_000 * scale),
  revisions: Math.round(300_000 * scale),
  audit: Math.round(1_000_000 * scale),
};
export const BENCH_PASSWORD = 'bench-only password 1';
/** The seeded people the benches sign in as: a compliance officer (reads everything), an author who also checks. */
export const BENCH_AUDITOR_SQL =
  "SELECT u.username, u.id FROM users u JOIN user_roles r ON r.user_id = u.id AND r.role = 'compliance' WHERE u.username LIKE 'kfd-%' LIMIT 1";
export const BENCH_WORKER_SQL =
  "SELECT u.username, u.id FROM users u JOIN user_roles a ON a.user_id = u.id AND a.role = 'author' JOIN user_roles c ON c.user_id = u.id AND c.role = 'checker' WHERE u.username LIKE 'kfd-%' LIMIT 1";

/** A small deterministic generator, so two seeds of the same size hold the same rows. */
export function prng(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
export const pick = <T>(rnd: () => number, list: readonly T[]): T => list[Math.floor(rnd() * list.length)];

export interface Variant {
  input: string;
  result: string | null;
  checklist: string | null;
  verdict: string | null;
  outcome: string;
}

/** Forty real engine and checklist records (body diameter and torque varied), reused across the seeded revisions. */
export async function variantsOf(doc: RuleSet): Promise<Variant[]> {
  const base = JSON.parse(
    readFileSync(join(__dirname, '..', 'test', 'fixtures', 'calcs', 'five-segment-fatigue.json'), 'utf8'),
  );
  const out: Variant[] = [];
  for (let v = 0; v < 40; v++) {
    const input = {
      ...base,
      segments: base.segments.map((s: { od: number }, k: number) => (k === 3 ? { ...s, od: s.od + (v % 8) - 2 } : s)),
    };
    out.push({ input: JSON.stringify(input), ...stored(await computeRecord(input, doc)) });
  }
  return out;
}

/** Multi-row INSERTs of up to 1,000 rows: several times faster here than the driver's bulk protocol. */
export async function insertRows(conn: Connection, head: string, rows: unknown[][]): Promise<void> {
  for (let i = 0; i < rows.length; i += 1000) {
    const part = rows.slice(i, i + 1000);
    const one = `(${part[0].map(() => '?').join(', ')})`;
    await conn.query(`${head} VALUES ${part.map(() => one).join(', ')}`, part.flat());
  }
}

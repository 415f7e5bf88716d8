// Invented people, projects and calc contents for the list benchmark (Kestrel Fen Drives).
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

const FIRST = [
  'Ada',
  'Bram',
  'Cleo',
  'Dov',
  'Elin',
  'Femi',
  'Greta',
  'Hugo',
  'Iris',
  'Jonas',
  'Kaia',
  'Leif',
  'Mira',
  'Nils',
  'Orla',
  'Pavel',
  'Quinn',
  'Runa',
  'Sven',
  'Tamsin',
];
const LAST = [
  'Ashdown',
  'Brackwater',
  'Cotterill',
  'Dunmore',
  'Ellery',
  'Fairweather',
  'Gorsuch',
  'Halloran',
  'Ingleby',
  'Jessop',
];

export interface Person {
  id: number;
  username: string;
  displayName: string;
  roles: string[];
  hash: string;
}

/** 200 people: authors, checkers, approvers, compliance and admins; some authors also check. */
export function peopleOf(hash: string): Person[] {
  return Array.from({ length: BENCH.people }, (_, i) => {
    const roles =
      i < 100
        ? i % 10 === 0
          ? ['author', 'checker']
          : ['author']
        : i < 150
          ? ['checker']
          : i < 180
            ? ['approver']
            : i < 190
              ? ['compliance']
              : ['admin'];
    return {
      id: 100_000 + i,
      username: `kfd-${String(i).padStart(3, '0')}`,
      displayName: `${FIRST[i % 20]} ${LAST[Math.floor(i / 20) % 10]}`,
      roles,
      hash,
    };
  });
}

const SITES = [
  'Marsh Lane',
  'Saltings',
  'Heron Quay',
  'Fenwick',
  'Reedmoor',
  'Otter Bank',
  'Sluice Gate',
  'Windpump',
  'Causeway',
  'Dykeside',
];
const KINDS = ['conveyor drives', 'pump station', 'mixer retrofit', 'hoist upgrade', 'fan line'];

export interface ProjectRow {
  id: number;
  code: string;
  name: string;
  client: string;
  description: string;
}

export function projectsOf(): ProjectRow[] {
  return Array.from({ length: BENCH.projects }, (_, i) => ({
    id: 100_000 + i,
    code: `KFD-B${String(i).padStart(2, '0')}`,
    name: `${SITES[i % 10]} ${KINDS[Math.floor(i / 10) % 5]}`,
    client: `${SITES[(i + 3) % 10]} Water Board`,
    description: 'Invented benchmark project of the Kestrel Fen Drives demo.',
  }));
}

const PARTS = [
  'input shaft',
  'output shaft',
  'head pulley shaft',
  'tail pulley shaft',
  'idler shaft',
  'impeller shaft',
  'agitator shaft',
  'drum shaft',
  'countershaft',
  'jackshaft',
];
const MACHINES = ['gearbox', 'conveyor', 'pump', 'mixer', 'hoist', 'fan', 'crusher', 'screen'];
export function titleOf(rnd: () => number): string {
  const machine = pick(rnd, MACHINES);
  return `${machine[0].toUpperCase()}${machine.slice(1)} ${pick(rnd, PARTS)}`;
}
export const partOf = (rnd: () => number) => `DRG-${1000 + Math.floor(rnd() * 9000)}-${pick(rnd, ['A', 'B', 'C'])}`;

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

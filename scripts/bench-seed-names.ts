// Invented people, projects, calc titles and drawing numbers for the list benchmark (Kestrel Fen Drives).
import { BENCH, pick } from './bench-seed-data';

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

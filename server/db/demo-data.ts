import type { Role } from '../../shared/authz/roles';
import type { CreateProjectRequest } from '../../shared/schemas/project.schema';

/**
 * Demo data for Kestrel Fen Drives Ltd., an invented maker of pump and conveyor drives.
 * Every name here is invented; the password is for the local demo only.
 */
export const DEMO_PASSWORD = 'kestrel-fen-demo';

export const DEMO_USERS: { username: string; displayName: string; email: string; roles: Role[] }[] = [
  { username: 'author', displayName: 'Morwenna Hale', email: 'm.hale@kestrelfen.example', roles: ['author'] },
  { username: 'checker', displayName: 'Tobias Okafor', email: 't.okafor@kestrelfen.example', roles: ['checker'] },
  {
    username: 'approver',
    displayName: 'Ingrid Lindqvist',
    email: 'i.lindqvist@kestrelfen.example',
    roles: ['approver'],
  },
  { username: 'compliance', displayName: 'Priya Raman', email: 'p.raman@kestrelfen.example', roles: ['compliance'] },
  // A second compliance officer: a standard change is proposed by one and confirmed by another, without admin help.
  {
    username: 'compliance2',
    displayName: 'Nell Ashdown',
    email: 'n.ashdown@kestrelfen.example',
    roles: ['compliance'],
  },
  { username: 'admin', displayName: 'Dale Fenwick', email: 'd.fenwick@kestrelfen.example', roles: ['admin'] },
  { username: 'senior', displayName: 'Owen Marsh', email: 'o.marsh@kestrelfen.example', roles: ['author', 'checker'] },
];

export const DEMO_PROJECTS: CreateProjectRequest[] = [
  {
    code: 'KFD-SP450',
    name: 'SP-450 slurry pump drive',
    client: 'Harrow Moss Minerals',
    description: 'Drive shaft between the 75 kW motor coupling and the SP-450 slurry pump impeller.',
    revisionScheme: 'letters',
  },
  {
    code: 'KFD-CV1200',
    name: 'CV-1200 conveyor head shaft',
    client: 'Saltmarsh Aggregates',
    description: 'Head pulley shaft of a 1200 mm belt conveyor with keyed hub and gearbox coupling.',
    revisionScheme: 'numbers',
  },
  {
    code: 'KFD-MX80',
    name: 'MX-80 hollow mixer shaft',
    client: 'Brindle Water Treatment',
    description: 'Hollow agitator shaft for an 80 m³ flocculation tank, top-entry gearbox drive.',
    revisionScheme: 'letters',
  },
];

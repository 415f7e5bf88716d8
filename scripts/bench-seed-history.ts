// The revision history of one benchmark calc: its revision rows and the signatures each state implies.
import { createHash } from 'node:crypto';
import type { RevisionState } from '../shared/schemas/revision.schema';
import type { Variant } from './bench-seed-data';
import type { Person } from './bench-seed-names';

// Where each calc's newest revision stands; older revisions were approved then superseded, or withdrawn.
const LATEST: [RevisionState, number][] = [
  ['approved', 0.45],
  ['draft', 0.2],
  ['in_check', 0.12],
  ['checked', 0.08],
  ['returned', 0.08],
  ['withdrawn', 0.07],
];

function latestState(rnd: () => number): RevisionState {
  let x = rnd();
  for (const [state, share] of LATEST) if ((x -= share) < 0) return state;
  return 'approved';
}

const label = (seq: number) => String.fromCharCode(65 + seq);
const hex = (text: string) => createHash('sha256').update(text).digest('hex');

export interface CalcTeam {
  author: Person;
  checker: Person;
  approver: Person;
}

/**
 * `n` revisions of one calc with consecutive ids from `firstId`, in the column order of the staging table
 * (variant index where the content goes). Draws the newest revision's state first, then one number per
 * older revision, so the seeded library depends only on the seed.
 */
export function revisionHistory(
  rnd: () => number,
  calc: { id: number; index: number; born: number; n: number; firstId: number },
  team: CalcTeam,
  ctx: { variants: Variant[]; ruleSetId: number },
): { revisions: unknown[][]; signatures: unknown[][] } {
  const { author, checker, approver } = team;
  const { n, born } = calc;
  const latest = latestState(rnd);
  const revisions: unknown[][] = [];
  const signatures: unknown[][] = [];
  for (let j = 0; j < n; j++) {
    const id = calc.firstId + j;
    const state: RevisionState = j < n - 1 ? (rnd() < 0.8 ? 'superseded' : 'withdrawn') : latest;
    const at = new Date(Math.min(Date.now() - 60_000, born + j * 30 * 86_400_000));
    const isSubmitted = !['draft', 'withdrawn'].includes(state);
    const isChecked = ['checked', 'approved', 'superseded'].includes(state);
    const isApproved = ['approved', 'superseded'].includes(state);
    const variant = (calc.index + j) % ctx.variants.length;
    const hash = hex(`${id}:${variant}`);
    const row = [
      id,
      calc.id,
      j,
      label(j),
      state,
      author.id,
      isChecked ? checker.id : null,
      isApproved ? approver.id : null,
      ctx.ruleSetId,
      variant,
      null,
      null,
      ctx.variants[variant].verdict,
      null,
      hash,
      j === 0 ? 'First issue' : 'Longer coupling seat after site survey',
      isSubmitted ? new Date(at.getTime() - 3_600_000) : null,
      isChecked ? new Date(at.getTime() - 1_800_000) : null,
      isApproved ? at : null,
      new Date(at.getTime() - 86_400_000),
      at,
    ];
    revisions.push(row);
    if (isSubmitted)
      signatures.push([id, author.id, author.displayName, 'author', 'authored', row[16], hash, `bench-${id}-a`]);
    if (isChecked)
      signatures.push([id, checker.id, checker.displayName, 'checker', 'checked', row[17], hash, `bench-${id}-c`]);
    if (isApproved)
      signatures.push([id, approver.id, approver.displayName, 'approver', 'approved', at, hash, `bench-${id}-p`]);
  }
  return { revisions, signatures };
}

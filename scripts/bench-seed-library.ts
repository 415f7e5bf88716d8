// Calcs, revisions, signatures and editors for the list benchmark, inserted in batches.
import { createHash } from 'node:crypto';
import type { Connection } from 'mariadb';
import type { RuleSetRecord } from '../server/db/models';
import type { RevisionState } from '../shared/schemas/revision.schema';
import { BENCH, insertRows, pick, prng, type Variant } from './bench-seed-data';
import { partOf, titleOf, type Person, type ProjectRow } from './bench-seed-names';

const YEAR_MS = 365.25 * 86_400_000;
const CHUNK = 1000;
// Where each calc's newest revision stands; older revisions were approved then superseded, or withdrawn.
const LATEST: [RevisionState, number][] = [
  ['approved', 0.45],
  ['draft', 0.2],
  ['in_check', 0.12],
  ['checked', 0.08],
  ['returned', 0.08],
  ['withdrawn', 0.07],
];

export interface Library {
  calcs: number;
  revisions: number;
  signatures: number;
  firstCalcId: number;
  firstRevisionId: number;
  revisionCalc: Int32Array;
  calcProject: Int32Array;
}

function latestState(rnd: () => number): RevisionState {
  let x = rnd();
  for (const [state, share] of LATEST) if ((x -= share) < 0) return state;
  return 'approved';
}

const label = (seq: number) => String.fromCharCode(65 + seq);
const hex = (text: string) => createHash('sha256').update(text).digest('hex');

/**
 * The forty contents go to the server once; each revision row then copies one of them inside the
 * server (INSERT … SELECT), instead of sending 30 kB of JSON per row over the wire.
 */
async function stageVariants(conn: Connection, variants: Variant[]): Promise<void> {
  await conn.query(`CREATE TEMPORARY TABLE bench_variants (id INT PRIMARY KEY, input LONGTEXT, result LONGTEXT, checklist LONGTEXT,
    verdict VARCHAR(20), outcome TEXT)`);
  await conn.batch(
    'INSERT INTO bench_variants VALUES (?, ?, ?, ?, ?, ?)',
    variants.map((v, i) => [i, v.input, v.result, v.checklist, v.verdict, v.outcome]),
  );
  await conn.query(`CREATE TEMPORARY TABLE bench_rows (id INT, calc_id INT, seq INT, label VARCHAR(8), status VARCHAR(20), author_id INT,
    checker_id INT, approver_id INT, rule_set_id INT, variant INT, unused1 INT, unused2 INT, verdict VARCHAR(20), unused3 INT, content_hash CHAR(64),
    reason_for_change TEXT, submitted_at DATETIME(3), checked_at DATETIME(3), approved_at DATETIME(3), created_at DATETIME(3), updated_at DATETIME(3))`);
}

/** Seeds the library; every table is written in id order so indexes grow at their ends. */
export async function seedLibrary(
  conn: Connection,
  ctx: { people: Person[]; projects: ProjectRow[]; variants: Variant[]; ruleSet: RuleSetRecord },
): Promise<Library> {
  const rnd = prng(12);
  const authors = ctx.people.filter((p) => p.roles.includes('author'));
  const checkers = ctx.people.filter((p) => p.roles.includes('checker'));
  const approvers = ctx.people.filter((p) => p.roles.includes('approver'));
  const [{ c, r }] = await conn.query(
    'SELECT COALESCE(MAX(id), 0) + 1 AS c, (SELECT COALESCE(MAX(id), 0) + 1 FROM revisions) AS r FROM calcs',
  );
  const lib: Library = {
    calcs: 0,
    revisions: 0,
    signatures: 0,
    firstCalcId: Number(c),
    firstRevisionId: Number(r),
    revisionCalc: new Int32Array(BENCH.revisions + BENCH.calcs),
    calcProject: new Int32Array(BENCH.calcs),
  };
  const start = Date.now() - 10 * YEAR_MS;
  await stageVariants(conn, ctx.variants);
  for (let from = 0; from < BENCH.calcs; from += CHUNK) {
    const calcs: unknown[][] = [];
    const revisions: unknown[][] = [];
    const signatures: unknown[][] = [];
    const editors: unknown[][] = [];
    for (let k = from; k < Math.min(BENCH.calcs, from + CHUNK); k++) {
      const calcId = lib.firstCalcId + k;
      const project = ctx.projects[k % ctx.projects.length];
      lib.calcProject[k] = project.id;
      const author = pick(rnd, authors);
      const checker = pick(
        rnd,
        checkers.filter((p) => p.id !== author.id),
      );
      const approver = pick(rnd, approvers);
      const n = 1 + (k % 5);
      const born = start + (k / BENCH.calcs) * 10 * YEAR_MS;
      const latest = latestState(rnd);
      let last: unknown[] = [];
      for (let j = 0; j < n; j++) {
        const id = lib.firstRevisionId + lib.revisions++;
        lib.revisionCalc[id - lib.firstRevisionId] = k;
        const state: RevisionState = j < n - 1 ? (rnd() < 0.8 ? 'superseded' : 'withdrawn') : latest;
        const at = new Date(Math.min(Date.now() - 60_000, born + j * 30 * 86_400_000));
        const isSubmitted = !['draft', 'withdrawn'].includes(state);
        const isChecked = ['checked', 'approved', 'superseded'].includes(state);
        const isApproved = ['approved', 'superseded'].includes(state);
        const variant = (k + j) % ctx.variants.length;
        const hash = hex(`${id}:${variant}`);
        const row = [
          id,
          calcId,
          j,
          label(j),
          state,
          author.id,
          isChecked ? checker.id : null,
          isApproved ? approver.id : null,
          ctx.ruleSet.id,
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
        last = row;
      }
      const since = (last[4] === 'in_check' ? last[16] : last[4] === 'checked' ? last[17] : null) ?? last[20];
      calcs.push([
        calcId,
        project.id,
        `${project.code}-${String(k).padStart(6, '0')}`,
        titleOf(rnd),
        partOf(rnd),
        author.id,
        new Date(born),
        last[20],
        last[0],
        n - 1,
        last[3],
        last[4],
        last[12],
        author.id,
        last[6],
        ctx.ruleSet.id,
        last[20],
        since,
        author.displayName,
      ]);
      editors.push([calcId, author.id, new Date(born)]);
    }
    await insertRows(
      conn,
      `INSERT INTO calcs (id, project_id, number, title, part_ref, created_by, created_at, updated_at, latest_revision_id, latest_seq,
      latest_label, latest_status, latest_verdict, latest_author_id, latest_checker_id, latest_rule_set_id, latest_updated_at, latest_since, author_name)`,
      calcs,
    );
    await insertRows(conn, `INSERT INTO bench_rows`, revisions);
    await conn.query(`INSERT INTO revisions (id, calc_id, seq, label, status, author_id, checker_id, approver_id, rule_set_id, input, result, checklist,
      verdict, outcome, content_hash, reason_for_change, submitted_at, checked_at, approved_at, created_at, updated_at, manual_items, lock_version)
      SELECT b.id, b.calc_id, b.seq, b.label, b.status, b.author_id, b.checker_id, b.approver_id, b.rule_set_id, v.input, v.result, v.checklist,
      v.verdict, v.outcome, b.content_hash, b.reason_for_change, b.submitted_at, b.checked_at, b.approved_at, b.created_at, b.updated_at, '{}', 1
      FROM bench_rows b JOIN bench_variants v ON v.id = b.variant ORDER BY b.id`);
    await conn.query('TRUNCATE TABLE bench_rows');
    if (signatures.length) {
      await insertRows(
        conn,
        'INSERT INTO signatures (revision_id, user_id, printed_name, role, meaning, signed_at, content_hash, idempotency_key)',
        signatures,
      );
    }
    await insertRows(conn, 'INSERT INTO calc_editors (calc_id, user_id, first_edit_at)', editors);
    lib.calcs += calcs.length;
    lib.signatures += signatures.length;
    if ((from / CHUNK) % 50 === 49) process.stdout.write(`  … ${lib.calcs.toLocaleString('en-US')} calcs\n`);
  }
  return lib;
}

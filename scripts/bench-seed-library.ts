// Calcs, revisions, signatures and editors for the list benchmark, inserted in batches.
import type { Connection } from 'mariadb';
import type { RuleSetRecord } from '../server/db/models';
import { BENCH, insertRows, pick, prng, type Variant } from './bench-seed-data';
import { revisionHistory } from './bench-seed-history';
import { partOf, titleOf, type Person, type ProjectRow } from './bench-seed-names';

const YEAR_MS = 365.25 * 86_400_000;
const CHUNK = 1000;

export interface Library {
  calcs: number;
  revisions: number;
  signatures: number;
  firstCalcId: number;
  firstRevisionId: number;
  revisionCalc: Int32Array;
  calcProject: Int32Array;
}

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
      const history = revisionHistory(
        rnd,
        { id: calcId, index: k, born, n, firstId: lib.firstRevisionId + lib.revisions },
        { author, checker, approver },
        { variants: ctx.variants, ruleSetId: ctx.ruleSet.id },
      );
      lib.revisionCalc.fill(k, lib.revisions, lib.revisions + n);
      lib.revisions += n;
      revisions.push(...history.revisions);
      signatures.push(...history.signatures);
      const last = history.revisions[n - 1];
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

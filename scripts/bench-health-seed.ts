// Review-health material for the benchmark library (npm run bench): findings on a third of the checks,
// quick checks, refused signatures as audit entries, attachment sets on check and approval signatures
// (some changed in between) and a stricter version of the standard in force today, so every signal has work.
import { createHash } from 'node:crypto';
import type { Connection } from 'mariadb';
import { prng } from './bench-seed-data';

// Seven in ten refusals a wrong password, then a missing, a wrong and a one-time code not set up.
const REASONS = [
  ...Array(7).fill('wrong password'),
  'one-time code missing',
  'one-time code wrong',
  'one-time code not set up',
];
const hex = (text: string) => createHash('sha256').update(text).digest('hex');
const FILE = (name: string, sha: string) => ({ name, kind: 'drawing', sizeBytes: 2048, sha256: sha });

async function batches(conn: Connection, sql: string, rows: unknown[][]): Promise<void> {
  for (let i = 0; i < rows.length; i += 2000) await conn.batch(sql, rows.slice(i, i + 2000));
}

/**
 * Adds the signals' material once; a library that has it (findings present) is left alone. True when it added
 * rows, which the signing path's facts (review-facts.ts) must then be worked out for.
 */
export async function seedHealthMaterial(conn: Connection): Promise<boolean> {
  const [{ n }] = await conn.query("SELECT COUNT(*) AS n FROM findings WHERE text LIKE 'Bench finding%'");
  if (Number(n) > 0) return false;
  const rnd = prng(15);
  const checked: {
    id: number;
    checker: number;
    checkedAt: Date;
    calcId: number;
    projectId: number;
    approver: number | null;
  }[] = await conn.query(
    `SELECT r.id, r.checker_id AS checker, r.checked_at AS checkedAt, r.calc_id AS calcId, c.project_id AS projectId, r.approver_id AS approver
     FROM revisions r JOIN calcs c ON c.id = r.calc_id WHERE r.checked_at IS NOT NULL`,
  );
  const findings = checked
    .filter(() => rnd() < 0.33)
    .map((r) => [r.id, `Bench finding on revision ${r.id}`, r.checker, r.checkedAt, r.checkedAt]);
  await batches(
    conn,
    "INSERT INTO findings (revision_id, text, status, raised_by, created_at, updated_at) VALUES (?, ?, 'closed', ?, ?, ?)",
    findings,
  );
  const quick = checked.filter(() => rnd() < 0.05).map((r) => [r.id]);
  await batches(conn, 'UPDATE revisions SET submitted_at = checked_at - INTERVAL 90 SECOND WHERE id = ?', quick);
  // Attachment sets: every check and approval covers a drawing; one approval in fifty covers one more file.
  const drawing = JSON.stringify([FILE('drawing.pdf', hex('drawing'))]);
  await conn.query(
    "UPDATE signatures SET attachments = ?, content_format = 2 WHERE meaning IN ('checked', 'approved')",
    [drawing],
  );
  const changed = checked
    .filter((r) => r.approver && rnd() < 0.02)
    .map((r) => [JSON.stringify([FILE('drawing.pdf', hex('drawing')), FILE('late.pdf', hex(`late${r.id}`))]), r.id]);
  await batches(conn, "UPDATE signatures SET attachments = ? WHERE revision_id = ? AND meaning = 'approved'", changed);
  await seedRefusals(conn, checked, rnd);
  console.log(
    `  review-health material: ${findings.length.toLocaleString('en-US')} findings, ${quick.length.toLocaleString('en-US')} quick checks, ${changed.length} changed attachment sets`,
  );
  return true;
}

/** Refused attempts as the signing path records them: audit entries with the calc and project they fall under. */
async function seedRefusals(
  conn: Connection,
  checked: { id: number; checker: number; checkedAt: Date; calcId: number; projectId: number }[],
  rnd: () => number,
): Promise<void> {
  const rows: unknown[][] = [];
  for (const r of checked.filter(() => rnd() < 0.04)) {
    const attempts = 1 + Math.floor(rnd() * 4);
    for (let a = 0; a < attempts; a++) {
      const at = new Date(r.checkedAt.getTime() - (attempts - a) * 20_000);
      const payload = JSON.stringify({
        meaning: 'checked',
        reason: REASONS[Math.min(REASONS.length - 1, Math.floor(rnd() * 10))],
      });
      rows.push([
        at,
        r.checker,
        'Bench checker',
        'revision.signature_refused',
        'Revision',
        String(r.id),
        payload,
        hex(`p${r.id}-${a}`),
        hex(`h${r.id}-${a}`),
        r.calcId,
        r.projectId,
      ]);
    }
  }
  await batches(
    conn,
    `INSERT INTO audit_events (occurred_at, actor_id, actor_name, action, entity_type, entity_id, payload, prev_hash, hash, calc_id, project_id)
    VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    rows,
  );
  console.log(`  refused signing attempts recorded: ${rows.length.toLocaleString('en-US')}`);
}

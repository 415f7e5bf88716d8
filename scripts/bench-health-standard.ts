import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import type { Connection } from 'mariadb';

/**
 * A stricter next version of the library's standard in force from today (the yield fraction lowered,
 * as compliance might after a code change), the old one retired: the verdict-flip and replaced-standard
 * signals then have every approval of the library to judge.
 */
export async function replaceStandardForBench(conn: Connection): Promise<void> {
  const [current] = await conn.query(
    "SELECT id, code, version, title, document FROM rule_sets WHERE code = 'KFD-ENG-014' AND status = 'effective' ORDER BY version DESC LIMIT 1",
  );
  const [{ n }] = await conn.query(
    "SELECT COUNT(*) AS n FROM rule_sets WHERE code = 'KFD-ENG-014' AND title LIKE '%(bench)'",
  );
  if (Number(n) > 0) return;
  const today = new Date().toISOString().slice(0, 10);
  const doc = JSON.parse(current.document);
  doc.parameters = doc.parameters.map((p: { name: string; value: unknown }) =>
    p.name === 'asmeSyFraction' ? { ...p, value: 0.03 } : p,
  );
  Object.assign(doc, {
    version: current.version + 1,
    status: 'effective',
    effectiveDate: today,
    title: `${current.title} (bench)`,
  });
  const hash = createHash('sha256')
    .update(canonicalize(doc) ?? '')
    .digest('hex');
  await conn.query(
    `INSERT INTO rule_sets (code, version, title, status, effective_date, document, content_hash, lock_version, created_at, updated_at)
    VALUES (?, ?, ?, 'effective', ?, ?, ?, 0, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))`,
    [current.code, doc.version, doc.title, today, JSON.stringify(doc), hash],
  );
  await conn.query("UPDATE rule_sets SET status = 'retired' WHERE id = ?", [current.id]);
}

import { QueryTypes, type Sequelize } from 'sequelize';
import type { HealthScope } from './health-scope';

interface Missing { id: number; hash: string | null; rows: number; segments: number; features: number }

/**
 * Sizes (checklist rows, segments, features) of the revisions checked in the period, counted once per
 * content hash and kept in `review_sizes`, so the quick-check query never reads the large compressed
 * texts again. A revision returned after its check and changed gets a new hash and is counted anew.
 * The read is a plain consistent read (no locks on revisions); the upsert touches only review_sizes.
 */
export async function fillReviewSizes(sequelize: Sequelize, scope: HealthScope): Promise<number> {
  const missing = await sequelize.query<Missing>(
    `SELECT r.id, r.content_hash AS hash, COALESCE(JSON_LENGTH(r.checklist, '$.rows'), 0) AS \`rows\`,
       COALESCE(JSON_LENGTH(r.input, '$.segments'), 0) AS segments, COALESCE(JSON_LENGTH(r.input, '$.features'), 0) AS features
     FROM revisions r LEFT JOIN review_sizes z ON z.revision_id = r.id
     WHERE r.checked_at >= ? AND r.checked_at < ? AND r.status IN ('checked', 'approved', 'superseded')
       AND (z.revision_id IS NULL OR NOT (z.content_hash <=> r.content_hash))`,
    { replacements: [scope.start, scope.end], type: QueryTypes.SELECT },
  );
  for (let i = 0; i < missing.length; i += 1000) {
    const batch = missing.slice(i, i + 1000);
    await sequelize.query(
      `INSERT INTO review_sizes (revision_id, content_hash, checklist_rows, segments, features) VALUES ${batch.map(() => '(?, ?, ?, ?, ?)').join(', ')}
       ON DUPLICATE KEY UPDATE content_hash = VALUES(content_hash), checklist_rows = VALUES(checklist_rows),
         segments = VALUES(segments), features = VALUES(features)`,
      { replacements: batch.flatMap((m) => [m.id, m.hash, Number(m.rows), Number(m.segments), Number(m.features)]) },
    );
  }
  return missing.length;
}

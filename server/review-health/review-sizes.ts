import { QueryTypes, type Sequelize } from 'sequelize';
import type { HealthScope } from './health-scope';

interface Missing {
  id: number;
  checkedAt: Date;
  rows: number;
  segments: number;
  features: number;
}

/**
 * Sizes (checklist rows, segments, features) of the revisions checked in the period, counted once per
 * content hash and kept in `review_sizes`, so the quick-check query never reads the large compressed
 * texts again. A revision returned after its check and checked again has a new check time and is counted anew.
 * Finding what is missing reads only the covering index (revisions_checked_cover) and review_sizes' key;
 * the texts are read for the missing rows alone. Plain consistent reads; the upsert touches only review_sizes.
 */
export async function fillReviewSizes(sequelize: Sequelize, scope: HealthScope): Promise<number> {
  const missing = await sequelize.query<Missing>(
    `SELECT t.id, t.checkedAt, COALESCE(JSON_LENGTH(r.checklist, '$.rows'), 0) AS \`rows\`,
       COALESCE(JSON_LENGTH(r.input, '$.segments'), 0) AS segments, COALESCE(JSON_LENGTH(r.input, '$.features'), 0) AS features
     FROM (SELECT r.id, r.checked_at AS checkedAt FROM revisions r FORCE INDEX (revisions_checked_cover)
             LEFT JOIN review_sizes z ON z.revision_id = r.id AND z.checked_at = r.checked_at
           WHERE r.checked_at >= ? AND r.checked_at < ? AND r.status IN ('checked', 'approved', 'superseded') AND z.revision_id IS NULL) t
       JOIN revisions r ON r.id = t.id`,
    { replacements: [scope.start, scope.end], type: QueryTypes.SELECT },
  );
  for (let i = 0; i < missing.length; i += 1000) {
    const batch = missing.slice(i, i + 1000);
    await sequelize.query(
      `INSERT INTO review_sizes (revision_id, checked_at, checklist_rows, segments, features) VALUES ${batch.map(() => '(?, ?, ?, ?, ?)').join(', ')}
       ON DUPLICATE KEY UPDATE checked_at = VALUES(checked_at), checklist_rows = VALUES(checklist_rows),
         segments = VALUES(segments), features = VALUES(features)`,
      {
        replacements: batch.flatMap((m) => [m.id, m.checkedAt, Number(m.rows), Number(m.segments), Number(m.features)]),
      },
    );
  }
  return missing.length;
}

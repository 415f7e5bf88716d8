import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { SignedAttachment } from '../calcs/revision-content';

/**
 * Facts the review-health signals count, kept on the revision row by the signature that makes them true,
 * in that signature's transaction, and covered by the period indexes (revisions_checked_cover,
 * revisions_approved_cover), so a signal over ten years of every project reads index entries only:
 * - at the check signature: the checklist rows, segments and features the checker had before them, and the
 *   findings that checker raised on the revision (a checked revision's content and the checker's findings no
 *   longer change: a return moves it out of the checked states, and a new check writes them anew);
 * - at the approval signature: how many files differ between the last check signature's attachment set and
 *   the approval's (null when either signature predates signed attachments).
 * The signatures and audit entries stay the record; these columns only say where to look.
 */
const CHECK_FACTS = `r.check_rows = COALESCE(JSON_LENGTH(r.checklist, '$.rows'), 0),
  r.check_segments = COALESCE(JSON_LENGTH(r.input, '$.segments'), 0),
  r.check_features = COALESCE(JSON_LENGTH(r.input, '$.features'), 0),
  r.check_findings = (SELECT COUNT(*) FROM findings f WHERE f.revision_id = r.id AND f.raised_by = r.checker_id)`;

/** Files added or removed between two signed attachment sets, by name. */
export function setChange(
  before: readonly SignedAttachment[],
  after: readonly SignedAttachment[],
): { added: string[]; removed: string[] } {
  const key = (a: SignedAttachment) => `${a.sha256}|${a.name}|${a.kind}`;
  const had = new Set(before.map(key));
  const has = new Set(after.map(key));
  return {
    added: after.filter((a) => !had.has(key(a))).map((a) => a.name),
    removed: before.filter((a) => !has.has(key(a))).map((a) => a.name),
  };
}

const changedCount = (checked: string | null, approved: string | null): number | null => {
  if (checked === null || approved === null) return null;
  const { added, removed } = setChange(JSON.parse(checked), JSON.parse(approved));
  return added.length + removed.length;
};

/** After a check signature's state change (checker stamped): the sizes and the checker's findings. */
export async function recordCheckFacts(sequelize: Sequelize, revisionId: number, transaction: Transaction) {
  await sequelize.query(`UPDATE revisions r SET ${CHECK_FACTS} WHERE r.id = ?`, {
    replacements: [revisionId],
    transaction,
  });
}

/** After an approval signature: the files changed since the last check signature. */
export async function recordApprovalFacts(
  sequelize: Sequelize,
  revisionId: number,
  approvedSet: string,
  transaction: Transaction,
) {
  const [last] = await sequelize.query<{ attachments: string | null }>(
    `SELECT attachments FROM signatures WHERE revision_id = ? AND meaning = 'checked' ORDER BY id DESC LIMIT 1`,
    { replacements: [revisionId], type: QueryTypes.SELECT, transaction },
  );
  await sequelize.query('UPDATE revisions SET attachments_changed = ? WHERE id = ?', {
    replacements: [changedCount(last?.attachments ?? null, approvedSet), revisionId],
    transaction,
  });
}

/**
 * Sets the facts of every checked and approved revision from the signatures and findings on record: the
 * migration that adds the columns, and the benchmark after it writes rows behind the signing path's back.
 */
export async function backfillReviewFacts(sequelize: Sequelize): Promise<void> {
  await sequelize.query(`UPDATE revisions r SET ${CHECK_FACTS} WHERE r.checked_at IS NOT NULL`);
  const last = (meaning: string) =>
    `(SELECT s.attachments FROM signatures s WHERE s.revision_id = r.id AND s.meaning = '${meaning}' ORDER BY s.id DESC LIMIT 1)`;
  for (let after = 0; ;) {
    const rows = await sequelize.query<{ id: number; checked: string | null; approved: string | null }>(
      `SELECT r.id, ${last('checked')} AS checked, ${last('approved')} AS approved FROM revisions r
       WHERE r.approved_at IS NOT NULL AND r.id > ? ORDER BY r.id LIMIT 2000`,
      { replacements: [after], type: QueryTypes.SELECT },
    );
    if (rows.length === 0) return;
    // Few distinct counts (mostly 0): one UPDATE per count.
    const byCount = new Map<number | null, number[]>();
    for (const r of rows) {
      const n = changedCount(r.checked, r.approved);
      if (!byCount.has(n)) byCount.set(n, []);
      byCount.get(n)!.push(r.id);
    }
    for (const [n, ids] of byCount)
      await sequelize.query('UPDATE revisions SET attachments_changed = ? WHERE id IN (?)', { replacements: [n, ids] });
    after = rows[rows.length - 1].id;
  }
}

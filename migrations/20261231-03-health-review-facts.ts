import { DataTypes, QueryTypes, type QueryInterface, type Sequelize, type Transaction } from 'sequelize';

/**
 * Review-health facts on the revision row (server/review-health/review-facts.ts): sizes and the checker's findings
 * at the check signature, files changed between check and approval, and the calc's project (a calc never moves, so
 * a trigger copies it once, on every insert path). The period indexes cover them, so every signal over one project
 * or all reads index entries only; `review_sizes` (counted on first look) is no longer needed.
 */
const COVERS: [string, string[], string[]][] = [
  [
    'revisions_checked_cover',
    ['checked_at', 'status', 'checker_id', 'author_id', 'calc_id', 'submitted_at'],
    ['project_id', 'check_rows', 'check_segments', 'check_features', 'check_findings'],
  ],
  [
    'revisions_approved_cover',
    ['approved_at', 'status', 'rule_set_id', 'calc_id', 'approver_id', 'verdict'],
    ['project_id', 'attachments_changed'],
  ],
];
const COLUMNS = ['check_rows', 'check_segments', 'check_features', 'check_findings', 'attachments_changed'];
const count = { type: DataTypes.INTEGER.UNSIGNED, allowNull: true };
const PROJECT_TRIGGER = `CREATE TRIGGER revisions_project_insert BEFORE INSERT ON revisions FOR EACH ROW
  SET NEW.project_id = (SELECT c.project_id FROM calcs c WHERE c.id = NEW.calc_id)`;

// Frozen copy of the facts as server/review-health/review-facts.ts defined them when this was written.
const CHECK_FACTS = `r.check_rows = COALESCE(JSON_LENGTH(r.checklist, '$.rows'), 0),
  r.check_segments = COALESCE(JSON_LENGTH(r.input, '$.segments'), 0),
  r.check_features = COALESCE(JSON_LENGTH(r.input, '$.features'), 0),
  r.check_findings = (SELECT COUNT(*) FROM findings f WHERE f.revision_id = r.id AND f.raised_by = r.checker_id)`;

interface SignedFile {
  sha256: string;
  name: string;
  kind: string;
}

/** Files added or removed between the last check signature's attachment set and the approval's, by name. */
function changedCount(checked: string | null, approved: string | null): number | null {
  if (checked === null || approved === null) return null;
  const key = (a: SignedFile) => `${a.sha256}|${a.name}|${a.kind}`;
  const before: SignedFile[] = JSON.parse(checked);
  const after: SignedFile[] = JSON.parse(approved);
  const had = new Set(before.map(key));
  const has = new Set(after.map(key));
  return after.filter((a) => !had.has(key(a))).length + before.filter((a) => !has.has(key(a))).length;
}

async function backfillReviewFacts(sequelize: Sequelize, transaction: Transaction): Promise<void> {
  await sequelize.query(`UPDATE revisions r SET ${CHECK_FACTS} WHERE r.checked_at IS NOT NULL`, { transaction });
  const last = (meaning: string) =>
    `(SELECT s.attachments FROM signatures s WHERE s.revision_id = r.id AND s.meaning = '${meaning}' ORDER BY s.id DESC LIMIT 1)`;
  for (let after = 0; ;) {
    const rows = await sequelize.query<{ id: number; checked: string | null; approved: string | null }>(
      `SELECT r.id, ${last('checked')} AS checked, ${last('approved')} AS approved FROM revisions r
       WHERE r.approved_at IS NOT NULL AND r.id > ? ORDER BY r.id LIMIT 2000`,
      { replacements: [after], type: QueryTypes.SELECT, transaction },
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
      await sequelize.query('UPDATE revisions SET attachments_changed = ? WHERE id IN (?)', {
        replacements: [n, ids],
        transaction,
      });
    after = rows[rows.length - 1].id;
  }
}

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('revisions', 'project_id', count);
  for (const column of COLUMNS) await qi.addColumn('revisions', column, count);
  // Per project, without reading calcs in the UPDATE: its trigger writes calcs (error 1442).
  const calcs = await qi.sequelize.query<{ id: number; projectId: number }>(
    'SELECT id, project_id AS projectId FROM calcs',
    { type: QueryTypes.SELECT },
  );
  const byProject = new Map<number, number[]>();
  for (const c of calcs) {
    if (!byProject.has(c.projectId)) byProject.set(c.projectId, []);
    byProject.get(c.projectId)!.push(c.id);
  }
  for (const [projectId, ids] of byProject)
    await qi.sequelize.query('UPDATE revisions SET project_id = ? WHERE calc_id IN (?)', {
      replacements: [projectId, ids],
    });
  await qi.sequelize.query(PROJECT_TRIGGER);
  for (const [name, before, added] of COVERS) {
    await qi.removeIndex('revisions', name);
    await qi.addIndex('revisions', [...before, ...added], { name });
  }
  await qi.sequelize.transaction((transaction) => backfillReviewFacts(qi.sequelize, transaction));
  await qi.dropTable('review_sizes');
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('review_sizes', {
    revision_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      primaryKey: true,
      references: { model: 'revisions', key: 'id' },
      onDelete: 'CASCADE',
    },
    checked_at: { type: DataTypes.DATE(3), allowNull: false },
    checklist_rows: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    segments: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    features: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
  });
  for (const [name, before] of COVERS) {
    await qi.removeIndex('revisions', name);
    await qi.addIndex('revisions', before, { name });
  }
  await qi.sequelize.query('DROP TRIGGER IF EXISTS revisions_project_insert');
  for (const column of ['project_id', ...COLUMNS]) await qi.removeColumn('revisions', column);
}

import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';
import { backfillReviewFacts } from '../server/review-health/review-facts';

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
  await backfillReviewFacts(qi.sequelize);
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

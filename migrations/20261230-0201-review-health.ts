import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Review-health signals (issue 15, part 2): the organisation's thresholds, the size of each checked
 * revision (counted once, since a checked revision's content no longer changes) and the indexes
 * the signal queries read by.
 */
const INDEXES: [string, string, string[]][] = [
  // Covering the signal queries, so a period's checks and approvals are read from the index alone,
  // never from the wide revision rows (input, result and checklist texts).
  [
    'revisions',
    'revisions_checked_cover',
    ['checked_at', 'status', 'checker_id', 'author_id', 'calc_id', 'submitted_at'],
  ],
  [
    'revisions',
    'revisions_approved_cover',
    ['approved_at', 'status', 'rule_set_id', 'calc_id', 'approver_id', 'verdict'],
  ],
  // Refused signatures by project and period, and across all projects by period.
  ['audit_events', 'audit_events_action_project_time', ['action', 'project_id', 'occurred_at']],
  ['audit_events', 'audit_events_action_time', ['action', 'occurred_at']],
];

const int = (defaultValue: number) => ({ type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue });

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('review_health_settings', {
    id: { type: DataTypes.TINYINT.UNSIGNED, primaryKey: true },
    quick_check_seconds_per_item: int(20),
    silent_checker_checks: int(10),
    pairing_share_percent: int(75),
    pairing_min_checks: int(5),
    refusal_repeat_count: int(3),
    replaced_within_days: int(30),
    lock_version: int(0),
    updated_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' } },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.sequelize.query('INSERT INTO review_health_settings (id, updated_at) VALUES (1, UTC_TIMESTAMP(3))');
  await qi.createTable('review_sizes', {
    revision_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      primaryKey: true,
      references: { model: 'revisions', key: 'id' },
      onDelete: 'CASCADE',
    },
    // The check the counts belong to: a revision returned after its check and checked again is counted again.
    checked_at: { type: DataTypes.DATE(3), allowNull: false },
    checklist_rows: int(0),
    segments: int(0),
    features: int(0),
  });
  for (const [table, name, fields] of INDEXES) await qi.addIndex(table, fields, { name });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const [table, name] of INDEXES) await qi.removeIndex(table, name);
  await qi.dropTable('review_sizes');
  await qi.dropTable('review_health_settings');
}

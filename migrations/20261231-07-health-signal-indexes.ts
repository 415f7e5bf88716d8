import type { QueryInterface } from 'sequelize';

/**
 * Indexes that let the slowest review-health signals read only the entries they count (issue 15's < 500 ms over
 * 10,000 calcs): the period covers (20261231-03) read every approval or check in the period and filter or group
 * them entry by entry.
 * - `revisions_open_approvals`: approvals still in force (status first), newest first, with their standard version
 *   and verdict: the verdict-flip candidates are one backward range, without the superseded approvals or a sort.
 * - `revisions_attachments_changed`: the approvals whose files changed after the check (a few in a hundred) first,
 *   so that signal reads those entries alone.
 * - `revisions_pair_checks`: checks by checker and author, so a long period's pair counts stream group by group
 *   instead of filling a temporary table (check-signals.ts chooses it by the period's share of the checks).
 */
const INDEXES: [string, string[]][] = [
  ['revisions_open_approvals', ['status', 'approved_at', 'rule_set_id', 'verdict', 'project_id']],
  [
    'revisions_attachments_changed',
    ['attachments_changed', 'approved_at', 'status', 'calc_id', 'rule_set_id', 'approver_id', 'project_id'],
  ],
  ['revisions_pair_checks', ['checker_id', 'author_id', 'checked_at', 'status', 'check_findings', 'project_id']],
];

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const [name, fields] of INDEXES) await qi.addIndex('revisions', fields, { name });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  // MariaDB drops the index it made for the checker's foreign key once the pair-led index can serve it: back first.
  const [kept] = await qi.sequelize.query("SHOW INDEX FROM revisions WHERE Key_name = 'checker_id'");
  if (kept.length === 0) await qi.addIndex('revisions', ['checker_id'], { name: 'checker_id' });
  for (const [name] of INDEXES) await qi.removeIndex('revisions', name);
}

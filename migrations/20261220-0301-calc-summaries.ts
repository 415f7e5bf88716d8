import { DataTypes, type QueryInterface } from 'sequelize';

// The states and their labels as they were when this migration was written (migrations never import
// live code: the workflow may gain states later, through migrations of its own).
const REVISION_STATES = ['draft', 'in_check', 'returned', 'checked', 'approved', 'superseded', 'withdrawn'] as const;
const STATE_LABELS: Record<(typeof REVISION_STATES)[number], string> = {
  draft: 'Draft',
  in_check: 'In check',
  returned: 'Returned',
  checked: 'Checked',
  approved: 'Approved',
  superseded: 'Superseded',
  withdrawn: 'Withdrawn',
};

/**
 * What lists show, kept on each calc row: its latest revision's label, state, verdict, author,
 * standard and last change, the project code, and one text for the search box. Triggers keep them
 * true inside the statement that changes a revision, project or person, so every write path (and
 * every later one) maintains them in its own transaction without remembering to.
 */
const COLUMNS = {
  latest_revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
  latest_seq: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
  latest_label: { type: DataTypes.STRING(8), allowNull: true },
  latest_status: { type: DataTypes.ENUM(...REVISION_STATES), allowNull: true },
  latest_verdict: { type: DataTypes.STRING(20), allowNull: true },
  latest_author_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
  latest_checker_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
  latest_rule_set_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
  latest_updated_at: { type: DataTypes.DATE(3), allowNull: true },
  /** When the latest revision entered its state: queues wait "since" this. */
  latest_since: { type: DataTypes.DATE(3), allowNull: true },
  project_code: { type: DataTypes.STRING(32), allowNull: false, defaultValue: '' },
  author_name: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
  search_text: { type: DataTypes.STRING(700), allowNull: false, defaultValue: '' },
};

const STATE_LABEL_SQL = `CASE NEW.latest_status ${REVISION_STATES.map((s) => `WHEN '${s}' THEN '${STATE_LABELS[s]}'`).join(' ')} ELSE '' END`;
const SEARCH_TEXT_SQL = `CONCAT_WS(' ', NEW.number, NEW.title, NEW.part_ref, NEW.project_code, NEW.author_name, ${STATE_LABEL_SQL})`;

const summaryOf = (r: string) => `latest_revision_id = ${r}.id, latest_seq = ${r}.seq, latest_label = ${r}.label,
  latest_status = ${r}.status, latest_verdict = ${r}.verdict, latest_author_id = ${r}.author_id,
  latest_checker_id = ${r}.checker_id, latest_rule_set_id = ${r}.rule_set_id, latest_updated_at = ${r}.updated_at,
  latest_since = COALESCE(CASE ${r}.status WHEN 'in_check' THEN ${r}.submitted_at WHEN 'checked' THEN ${r}.checked_at END, ${r}.updated_at),
  author_name = COALESCE((SELECT u.display_name FROM users u WHERE u.id = ${r}.author_id), '')`;

// The newest revision (highest seq) wins; older revisions changing state (superseded) leave the summary alone.
const FROM_REVISION = `UPDATE calcs SET ${summaryOf('NEW')} WHERE id = NEW.calc_id AND (latest_seq IS NULL OR latest_seq <= NEW.seq)`;

const TRIGGERS: Record<string, string> = {
  calcs_summary_insert: `BEFORE INSERT ON calcs FOR EACH ROW BEGIN
    SET NEW.project_code = COALESCE((SELECT code FROM projects WHERE id = NEW.project_id), '');
    SET NEW.search_text = ${SEARCH_TEXT_SQL}; END`,
  calcs_summary_update: `BEFORE UPDATE ON calcs FOR EACH ROW SET NEW.search_text = ${SEARCH_TEXT_SQL}`,
  revisions_summary_insert: `AFTER INSERT ON revisions FOR EACH ROW ${FROM_REVISION}`,
  revisions_summary_update: `AFTER UPDATE ON revisions FOR EACH ROW ${FROM_REVISION}`,
  projects_summary_update: `AFTER UPDATE ON projects FOR EACH ROW
    IF NEW.code <> OLD.code THEN UPDATE calcs SET project_code = NEW.code WHERE project_id = NEW.id; END IF`,
  users_summary_update: `AFTER UPDATE ON users FOR EACH ROW
    IF NEW.display_name <> OLD.display_name THEN UPDATE calcs SET author_name = NEW.display_name WHERE latest_author_id = NEW.id; END IF`,
};

// InnoDB appends the primary key to every secondary index, so each of these also orders ties by id (keyset pages).
const INDEXES: [string, string[]][] = [
  ['calcs_project_updated', ['project_id', 'latest_updated_at']],
  ['calcs_project_title', ['project_id', 'title']],
  ['calcs_project_state', ['project_id', 'latest_status', 'latest_updated_at']],
  ['calcs_updated', ['latest_updated_at']],
  ['calcs_number', ['number']],
  ['calcs_title', ['title']],
  ['calcs_state', ['latest_status', 'latest_updated_at']],
  ['calcs_state_since', ['latest_status', 'latest_since']],
  ['calcs_author_state', ['latest_author_id', 'latest_status', 'latest_since']],
];

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const [name, spec] of Object.entries(COLUMNS)) await qi.addColumn('calcs', name, spec);
  for (const [name, fields] of INDEXES) await qi.addIndex('calcs', fields, { name });
  await qi.sequelize.query('ALTER TABLE calcs ADD FULLTEXT INDEX calcs_search (search_text)');
  for (const [name, body] of Object.entries(TRIGGERS)) await qi.sequelize.query(`CREATE TRIGGER ${name} ${body}`);
  // Existing rows: project code first, then each calc's newest revision (the update fires the search-text trigger).
  // Data only, so one transaction holds it (DDL commits implicitly in MariaDB): all rows or none.
  await qi.sequelize.transaction(async (transaction) => {
    await qi.sequelize.query('UPDATE calcs c JOIN projects p ON p.id = c.project_id SET c.project_code = p.code', {
      transaction,
    });
    await qi.sequelize.query(
      `UPDATE calcs c JOIN revisions r ON r.calc_id = c.id
      AND r.seq = (SELECT MAX(r2.seq) FROM revisions r2 WHERE r2.calc_id = c.id) SET ${summaryOf('r')}`,
      { transaction },
    );
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const name of Object.keys(TRIGGERS)) await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${name}`);
  await qi.removeIndex('calcs', 'calcs_search');
  for (const [name] of INDEXES) await qi.removeIndex('calcs', name);
  for (const name of Object.keys(COLUMNS)) await qi.removeColumn('calcs', name);
}

import type { QueryInterface } from 'sequelize';

/**
 * A list filtered by state and sorted by number or title (within a project or across the library) read every calc
 * in that state and sorted them before keeping a page: on 100,000 calcs a project's approved calcs by number were
 * 899 row reads and a sort for 51 rows. With the state before the sort column, the page is one index range in
 * order. Saves do not touch these columns (only a change of state, number or title moves an entry).
 */
const INDEXES: [string, string[]][] = [
  ['calcs_project_state_number', ['project_id', 'latest_status', 'number']],
  ['calcs_project_state_title', ['project_id', 'latest_status', 'title']],
  ['calcs_state_number', ['latest_status', 'number']],
  ['calcs_state_title', ['latest_status', 'title']],
];

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const [name, fields] of INDEXES) await qi.addIndex('calcs', fields, { name });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const [name] of INDEXES) await qi.removeIndex('calcs', name);
}

import type { QueryInterface } from 'sequelize';

/**
 * An auditor's "signatures in this project" walks the project's entries newest first until a page of them has the
 * action asked for. With the project index alone each entry walked was a read of its row to test the action, and in a
 * project whose recent entries are mostly saves that was thousands of rows (2,900 to 5,600 on the bench library, 6 to
 * 14 ms). With the action in the project's index the walk reads index entries only, and the page's rows are read by
 * id (server/audit/audit-read.service.ts). It replaces the project index, whose every use it serves (the id after the
 * project, as InnoDB appended it, is the same order).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(
    'ALTER TABLE audit_events ADD INDEX audit_events_project_walk (project_id, id, action), DROP INDEX audit_events_project',
  );
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(
    'ALTER TABLE audit_events ADD INDEX audit_events_project (project_id), DROP INDEX audit_events_project_walk',
  );
}

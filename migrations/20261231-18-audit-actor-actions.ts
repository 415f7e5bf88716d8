import type { QueryInterface } from 'sequelize';

/**
 * "What did this person sign": an action within one person's entries, walked newest first as a project's are
 * (20261231-17): with the action in the person's index the walk reads index entries only, where it read a row per
 * entry to test its action (a person whose recent entries are mostly saves: 26 ms alone for a page of signatures on
 * the bench library). It replaces the person index, whose every use it serves (the id after the person, as InnoDB
 * appended it, is the same order).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(
    'ALTER TABLE audit_events ADD INDEX audit_events_actor_walk (actor_id, id, action), DROP INDEX audit_events_actor_id',
  );
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(
    'ALTER TABLE audit_events ADD INDEX audit_events_actor_id (actor_id), DROP INDEX audit_events_actor_walk',
  );
}

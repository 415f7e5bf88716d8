import type { QueryInterface } from 'sequelize';

/**
 * The approvers' queue counts the calcs waiting in a state less those its reader may not take: the ones they checked
 * and the ones with no checker (server/dashboard/queues.ts). With the checker before the state, each of those is one
 * short index range instead of a read of every calc in the state. Saves do not touch these columns (only a signature
 * or a new revision moves an entry).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addIndex('calcs', ['latest_checker_id', 'latest_status'], { name: 'calcs_checker_state' });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeIndex('calcs', 'calcs_checker_state');
}

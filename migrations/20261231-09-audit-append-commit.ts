import type { QueryInterface } from 'sequelize';

/**
 * `audit_append_commit`: `audit_append` (20261231-06), then COMMIT, in one statement, for a write whose audit entry
 * is its last statement (a save). The chain head is locked from the append until the commit; with the COMMIT sent
 * by the app it stayed locked for a trip back to the app's event loop, which under load is busy with other
 * requests, so every writer in the company waited for that hop too (issue 12's saves). If the append fails, the
 * procedure stops before its COMMIT and the caller rolls back as before; the entry and the change it records still
 * commit together or not at all, and `verifyAuditChain` is unchanged.
 */
const PROCEDURE = `CREATE PROCEDURE audit_append_commit(
    IN p_actor_id INT UNSIGNED, IN p_actor_name TEXT CHARACTER SET utf8mb4, IN p_action TEXT CHARACTER SET utf8mb4,
    IN p_entity_type TEXT CHARACTER SET utf8mb4, IN p_entity_id TEXT CHARACTER SET utf8mb4,
    IN p_payload LONGTEXT CHARACTER SET utf8mb4, IN p_diff LONGTEXT CHARACTER SET utf8mb4,
    IN p_ip TEXT CHARACTER SET utf8mb4, IN p_calc_id INT UNSIGNED, IN p_project_id INT UNSIGNED,
    IN p_before LONGTEXT CHARACTER SET utf8mb4, IN p_after LONGTEXT CHARACTER SET utf8mb4)
  MODIFIES SQL DATA
BEGIN
  CALL audit_append(p_actor_id, p_actor_name, p_action, p_entity_type, p_entity_id, p_payload, p_diff, p_ip,
    p_calc_id, p_project_id, p_before, p_after);
  COMMIT;
END`;

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('DROP PROCEDURE IF EXISTS audit_append_commit');
  await qi.sequelize.query(PROCEDURE);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('DROP PROCEDURE IF EXISTS audit_append_commit');
}

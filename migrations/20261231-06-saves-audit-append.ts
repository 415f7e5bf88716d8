import type { QueryInterface } from 'sequelize';

/**
 * One audit append as one statement (`CALL audit_append`): lock the chain head, stamp the time, hash, insert the
 * row and move the head, all inside the database. The head row is then locked for one round trip and the commit,
 * instead of a locked read, a trip back to the app for the hash, an insert and an update, each waiting for the
 * app's event loop while every other writer in the company queues behind the lock (issue 12's save target).
 *
 * The hash is the one `chainHash` (server/audit/audit-chain.ts) computes and `verifyAuditChain` checks:
 * SHA-256 over the previous hash and the canonical JSON of the row's content. The app sends that JSON in two
 * halves around the time (`before` ends with `"occurredAt":"`, `after` starts with the closing quote), since the
 * time is taken after the lock, so that times rise with ids. MariaDB's SHA2 over utf8mb4 text hashes its UTF-8
 * bytes, as Node does.
 */
const PROCEDURE = `CREATE PROCEDURE audit_append(
    IN p_actor_id INT UNSIGNED, IN p_actor_name TEXT CHARACTER SET utf8mb4, IN p_action TEXT CHARACTER SET utf8mb4,
    IN p_entity_type TEXT CHARACTER SET utf8mb4, IN p_entity_id TEXT CHARACTER SET utf8mb4,
    IN p_payload LONGTEXT CHARACTER SET utf8mb4, IN p_diff LONGTEXT CHARACTER SET utf8mb4,
    IN p_ip TEXT CHARACTER SET utf8mb4, IN p_calc_id INT UNSIGNED, IN p_project_id INT UNSIGNED,
    IN p_before LONGTEXT CHARACTER SET utf8mb4, IN p_after LONGTEXT CHARACTER SET utf8mb4)
  MODIFIES SQL DATA
BEGIN
  DECLARE prev CHAR(64) CHARACTER SET utf8mb4;
  DECLARE ts DATETIME(3);
  DECLARE h CHAR(64) CHARACTER SET utf8mb4;
  SELECT last_hash INTO prev FROM audit_chain_head WHERE id = 1 FOR UPDATE;
  SET ts = UTC_TIMESTAMP(3);
  SET h = SHA2(CONCAT(prev, p_before, DATE_FORMAT(ts, '%Y-%m-%dT%H:%i:%s.'),
    LPAD(MICROSECOND(ts) DIV 1000, 3, '0'), 'Z', p_after), 256);
  INSERT INTO audit_events (occurred_at, actor_id, actor_name, action, entity_type, entity_id, payload, diff, ip,
    prev_hash, hash, calc_id, project_id)
  VALUES (ts, p_actor_id, p_actor_name, p_action, p_entity_type, p_entity_id, p_payload, p_diff, p_ip,
    prev, h, p_calc_id, p_project_id);
  UPDATE audit_chain_head SET last_id = LAST_INSERT_ID(), last_hash = h WHERE id = 1;
END`;

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('DROP PROCEDURE IF EXISTS audit_append');
  await qi.sequelize.query(PROCEDURE);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('DROP PROCEDURE IF EXISTS audit_append');
}

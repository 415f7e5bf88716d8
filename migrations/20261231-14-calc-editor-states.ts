import type { QueryInterface } from 'sequelize';

/**
 * Each editor row carries its calc's latest state, kept true by triggers in the statement that changes it, so that a
 * checker's or approver's queue can count the calcs of a state they edited by one short index range
 * (`calc_editors_user_state`) instead of reading each edited calc (server/dashboard/queues.ts): a person who wrote a
 * thousand calcs made every count of their queues a thousand row reads. The states as they were when written.
 */
const STATES = "'draft','in_check','returned','checked','approved','superseded','withdrawn'";

const TRIGGERS: Record<string, string> = {
  calc_editors_state_insert: `BEFORE INSERT ON calc_editors FOR EACH ROW
    SET NEW.latest_status = (SELECT c.latest_status FROM calcs c WHERE c.id = NEW.calc_id)`,
  calcs_editors_state_update: `AFTER UPDATE ON calcs FOR EACH ROW
    IF NOT (NEW.latest_status <=> OLD.latest_status) THEN
      UPDATE calc_editors SET latest_status = NEW.latest_status WHERE calc_id = NEW.id;
    END IF`,
};

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  const db = qi.sequelize;
  await db.query(`ALTER TABLE calc_editors ADD COLUMN latest_status ENUM(${STATES}) NULL,
    ADD INDEX calc_editors_user_state (user_id, latest_status)`);
  await db.query('UPDATE calc_editors e JOIN calcs c ON c.id = e.calc_id SET e.latest_status = c.latest_status');
  for (const [name, body] of Object.entries(TRIGGERS)) await db.query(`CREATE TRIGGER ${name} ${body}`);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  const db = qi.sequelize;
  for (const name of Object.keys(TRIGGERS)) await db.query(`DROP TRIGGER IF EXISTS ${name}`);
  await db.query('ALTER TABLE calc_editors DROP INDEX calc_editors_user_state, DROP COLUMN latest_status');
}

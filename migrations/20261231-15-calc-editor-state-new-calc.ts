import type { QueryInterface } from 'sequelize';

/**
 * A calc's first revision moves its state from none to draft, and the trigger that keeps its editor rows' state
 * (20261231-14) then updated a range of `calc_editors` with no row in it: under REPEATABLE READ that locks the gap
 * after it, at the end of the table for the newest calcs. Two calcs created at once both held that gap and then each
 * inserted its author's editor row into it: a deadlock, retried by the app, with the connection closed each time
 * (Sequelize cannot roll back to a savepoint the deadlock has already undone). A calc with no state yet has no editor
 * row (its creator's is inserted after its first revision, and takes the state then), so the trigger skips it.
 */
const KEEP_STATE = `AFTER UPDATE ON calcs FOR EACH ROW
    IF NOT (NEW.latest_status <=> OLD.latest_status) THEN
      UPDATE calc_editors SET latest_status = NEW.latest_status WHERE calc_id = NEW.id;
    END IF`;

const SKIP_NEW_CALC = `AFTER UPDATE ON calcs FOR EACH ROW
    IF OLD.latest_status IS NOT NULL AND NOT (NEW.latest_status <=> OLD.latest_status) THEN
      UPDATE calc_editors SET latest_status = NEW.latest_status WHERE calc_id = NEW.id;
    END IF`;

async function replace(qi: QueryInterface, body: string): Promise<void> {
  await qi.sequelize.query('DROP TRIGGER IF EXISTS calcs_editors_state_update');
  await qi.sequelize.query(`CREATE TRIGGER calcs_editors_state_update ${body}`);
}

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await replace(qi, SKIP_NEW_CALC);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await replace(qi, KEEP_STATE);
}

import type { QueryInterface } from 'sequelize';

/**
 * Refused signing attempts summed per UTC day (issue 15's < 500 ms): the refusals signal grouped every refused
 * attempt's audit entry, reading each entry's row for its reason. `signing_refusal_days` holds one row per day,
 * person, name, revision, calc, project and reason with the attempts and the first and last of them, written by a
 * trigger in the statement that appends the audit entry, so every insert path keeps it (the trail is append-only:
 * `audit_events_no_update`, `audit_events_no_delete`). The signal sums those rows over the period's days: the same
 * counts, names, first and last times as the entries themselves. The audit entries stay the record.
 */
const KEY = `d.day = DATE(NEW.occurred_at) AND d.actor_id <=> NEW.actor_id AND d.actor_name = NEW.actor_name
  AND d.entity_id <=> NEW.entity_id AND d.calc_id <=> NEW.calc_id AND d.project_id <=> NEW.project_id
  AND d.reason <=> JSON_VALUE(NEW.payload, '$.reason')`;
// Two first refusals at once may both insert: the signal sums rows, so a second row for one key counts the same.
const TRIGGER = `CREATE TRIGGER audit_events_refusal_days AFTER INSERT ON audit_events FOR EACH ROW
BEGIN
  IF NEW.action = 'revision.signature_refused' THEN
    UPDATE signing_refusal_days d SET d.attempts = d.attempts + 1, d.first_at = LEAST(d.first_at, NEW.occurred_at),
      d.last_at = GREATEST(d.last_at, NEW.occurred_at)
    WHERE ${KEY};
    IF ROW_COUNT() = 0 THEN
      INSERT INTO signing_refusal_days (day, actor_id, actor_name, entity_id, calc_id, project_id, reason, attempts,
        first_at, last_at)
      VALUES (DATE(NEW.occurred_at), NEW.actor_id, NEW.actor_name, NEW.entity_id, NEW.calc_id, NEW.project_id,
        JSON_VALUE(NEW.payload, '$.reason'), 1, NEW.occurred_at, NEW.occurred_at);
    END IF;
  END IF;
END`;

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  const q = (sql: string) => qi.sequelize.query(sql);
  // Clustered by day, so a period over every project is one range of whole rows; one project's by its own index.
  // The columns match audit_events' own.
  await q(`CREATE TABLE signing_refusal_days (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT,
    day DATE NOT NULL,
    actor_id INT UNSIGNED NULL,
    actor_name VARCHAR(120) NOT NULL,
    entity_id VARCHAR(64) NULL,
    calc_id INT UNSIGNED NULL,
    project_id INT UNSIGNED NULL,
    reason VARCHAR(255) NULL,
    attempts INT UNSIGNED NOT NULL,
    first_at DATETIME(3) NOT NULL,
    last_at DATETIME(3) NOT NULL,
    PRIMARY KEY (day, id),
    KEY signing_refusal_days_id (id),
    KEY signing_refusal_days_project (project_id, day)
  ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  await q(TRIGGER);
  // Entries appended before the trigger (migrations run before the app serves, so none arrive meanwhile).
  await qi.sequelize.transaction((transaction) =>
    qi.sequelize.query(
      `INSERT INTO signing_refusal_days (day, actor_id, actor_name, entity_id, calc_id, project_id, reason, attempts,
         first_at, last_at)
       SELECT DATE(e.occurred_at), e.actor_id, e.actor_name, e.entity_id, e.calc_id, e.project_id,
         JSON_VALUE(e.payload, '$.reason'), COUNT(*), MIN(e.occurred_at), MAX(e.occurred_at)
       FROM audit_events e WHERE e.action = 'revision.signature_refused'
       GROUP BY DATE(e.occurred_at), e.actor_id, e.actor_name, e.entity_id, e.calc_id, e.project_id,
         JSON_VALUE(e.payload, '$.reason')`,
      { transaction },
    ),
  );
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('DROP TRIGGER IF EXISTS audit_events_refusal_days');
  await qi.sequelize.query('DROP TABLE IF EXISTS signing_refusal_days');
}

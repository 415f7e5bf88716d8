import type { QueryInterface } from 'sequelize';

/**
 * A save no longer rewrites its calc's search terms (issue 12). Every term row carries its calc's last change so that a
 * search "newest first" walks the term's index in the list's own order, and each save moved it in about fifty rows
 * (every prefix of every word), each in two indexes: 1.1–1.3 ms of MariaDB's 3.1–3.3 ms a save. A save that moves only
 * the last change now records it in `calc_search_moved`, one row per calc, and leaves the terms as they were; a search
 * by last change takes those calcs from that table, at their true time, and the rest from the term index
 * (calc-search.ts). The rows are folded back into the terms by the app a few minutes after a calc's last save
 * (search-restamp.ts), and at once whenever the terms are written anyway (a new state, new words, another project).
 * Either a calc's moved row holds its last change, or all its term rows do. The term rows as written by
 * 20261231-0401 (migrations never import live code).
 */
const TERM_LENGTH = 12;
const PREFIX_LENGTHS = `[${Array.from({ length: TERM_LENGTH }, (_, i) => i + 1).join(',')}]`;
const TERM_ROWS = `INSERT IGNORE INTO calc_search_terms
  (calc_id, term, project_id, latest_status, latest_updated_at, number, title)
  SELECT NEW.id, LEFT(w.word, n.n), NEW.project_id, NEW.latest_status, NEW.latest_updated_at, NEW.number, NEW.title
  FROM JSON_TABLE(CONCAT('["', REPLACE(TRIM(REGEXP_REPLACE(NEW.search_text, '[^\\\\p{L}\\\\p{N}]+', ' ')), ' ', '","'), '"]'),
    '$[*]' COLUMNS (word VARCHAR(700) CHARACTER SET utf8mb4 PATH '$')) w
  JOIN JSON_TABLE('${PREFIX_LENGTHS}', '$[*]' COLUMNS (n INT PATH '$')) n ON n.n <= CHAR_LENGTH(w.word)`;

const MOVED: Record<string, string> = {
  calcs_terms_update: `AFTER UPDATE ON calcs FOR EACH ROW BEGIN
    IF NOT (BINARY NEW.search_text <=> BINARY OLD.search_text) OR NEW.project_id <> OLD.project_id THEN
      DELETE FROM calc_search_terms WHERE calc_id = NEW.id;
      ${TERM_ROWS};
      DELETE FROM calc_search_moved WHERE calc_id = NEW.id;
    ELSEIF NOT (NEW.latest_status <=> OLD.latest_status) THEN
      UPDATE calc_search_terms SET latest_updated_at = NEW.latest_updated_at, latest_status = NEW.latest_status
      WHERE calc_id = NEW.id;
      DELETE FROM calc_search_moved WHERE calc_id = NEW.id;
    ELSEIF NOT (NEW.latest_updated_at <=> OLD.latest_updated_at) THEN
      INSERT INTO calc_search_moved (calc_id, latest_updated_at) VALUES (NEW.id, NEW.latest_updated_at)
      ON DUPLICATE KEY UPDATE latest_updated_at = NEW.latest_updated_at;
    END IF; END`,
  calcs_terms_delete: `AFTER DELETE ON calcs FOR EACH ROW BEGIN
    DELETE FROM calc_search_terms WHERE calc_id = OLD.id;
    DELETE FROM calc_search_moved WHERE calc_id = OLD.id;
  END`,
};

const EVERY_SAVE: Record<string, string> = {
  calcs_terms_update: `AFTER UPDATE ON calcs FOR EACH ROW BEGIN
    IF NOT (BINARY NEW.search_text <=> BINARY OLD.search_text) OR NEW.project_id <> OLD.project_id THEN
      DELETE FROM calc_search_terms WHERE calc_id = NEW.id;
      ${TERM_ROWS};
    ELSEIF NOT (NEW.latest_updated_at <=> OLD.latest_updated_at) OR NOT (NEW.latest_status <=> OLD.latest_status) THEN
      UPDATE calc_search_terms SET latest_updated_at = NEW.latest_updated_at, latest_status = NEW.latest_status
      WHERE calc_id = NEW.id;
    END IF; END`,
  calcs_terms_delete: `AFTER DELETE ON calcs FOR EACH ROW DELETE FROM calc_search_terms WHERE calc_id = OLD.id`,
};

async function replaceTriggers(qi: QueryInterface, triggers: Record<string, string>): Promise<void> {
  for (const [name, body] of Object.entries(triggers)) {
    await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${name}`);
    await qi.sequelize.query(`CREATE TRIGGER ${name} ${body}`);
  }
}

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  // The time is NULL only while a calc is being created, before its first revision.
  await qi.sequelize.query(`CREATE TABLE calc_search_moved (
    calc_id INT UNSIGNED NOT NULL PRIMARY KEY,
    latest_updated_at DATETIME(3) NULL,
    KEY moved_updated (latest_updated_at)
  ) ENGINE=InnoDB`);
  await replaceTriggers(qi, MOVED);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`UPDATE calc_search_terms t JOIN calc_search_moved m ON m.calc_id = t.calc_id
    SET t.latest_updated_at = m.latest_updated_at`);
  await replaceTriggers(qi, EVERY_SAVE);
  await qi.sequelize.query('DROP TABLE calc_search_moved');
}

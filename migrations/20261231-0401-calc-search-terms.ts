import type { QueryInterface } from 'sequelize';

/**
 * The search box (issue 12): every prefix (1 to 12 letters) of every word of a calc's search text
 * gets a row carrying the calc's sort values, and each list order has an index led by the term.
 * A search then walks one term's index in the list's own order and stops after a page, however
 * many calcs the word matches; full-text search had to sort every match first (0.8 s for a word
 * in 80 % of 100,000 calcs). Triggers on `calcs` keep the rows true in the statement that changes
 * the calc (its summary triggers fire first), so every write path maintains them in its own
 * transaction. The states as they were when written (migrations never import live code).
 */
const STATES = "'draft','in_check','returned','checked','approved','superseded','withdrawn'";
const TERM_LENGTH = 12;
const PREFIX_LENGTHS = `[${Array.from({ length: TERM_LENGTH }, (_, i) => i + 1).join(',')}]`;

/** Rows of one calc (`src` is NEW in a trigger, `c` in the backfill); words split on all but letters and digits. */
const termRows = (
  src: string,
  from = '',
) => `SELECT ${src}.id, LEFT(w.word, n.n), ${src}.project_id, ${src}.latest_status,
    ${src}.latest_updated_at, ${src}.number, ${src}.title
  FROM ${from}JSON_TABLE(CONCAT('["', REPLACE(TRIM(REGEXP_REPLACE(${src}.search_text, '[^\\\\p{L}\\\\p{N}]+', ' ')), ' ', '","'), '"]'),
    '$[*]' COLUMNS (word VARCHAR(700) CHARACTER SET utf8mb4 PATH '$')) w
  JOIN JSON_TABLE('${PREFIX_LENGTHS}', '$[*]' COLUMNS (n INT PATH '$')) n ON n.n <= CHAR_LENGTH(w.word)`;
const INSERT = `INSERT IGNORE INTO calc_search_terms
  (calc_id, term, project_id, latest_status, latest_updated_at, number, title)`;

const TRIGGERS: Record<string, string> = {
  calcs_terms_insert: `AFTER INSERT ON calcs FOR EACH ROW ${INSERT} ${termRows('NEW')}`,
  // A save moves only the last change; a new state, title, author or project code changes the words.
  calcs_terms_update: `AFTER UPDATE ON calcs FOR EACH ROW BEGIN
    IF NOT (BINARY NEW.search_text <=> BINARY OLD.search_text) OR NEW.project_id <> OLD.project_id THEN
      DELETE FROM calc_search_terms WHERE calc_id = NEW.id;
      ${INSERT} ${termRows('NEW')};
    ELSEIF NOT (NEW.latest_updated_at <=> OLD.latest_updated_at) OR NOT (NEW.latest_status <=> OLD.latest_status) THEN
      UPDATE calc_search_terms SET latest_updated_at = NEW.latest_updated_at, latest_status = NEW.latest_status
      WHERE calc_id = NEW.id;
    END IF; END`,
  calcs_terms_delete: `AFTER DELETE ON calcs FOR EACH ROW DELETE FROM calc_search_terms WHERE calc_id = OLD.id`,
};

// One per list order; InnoDB appends the calc id, which breaks ties as the calc list's own indexes do.
const INDEXES = `ADD INDEX terms_updated (term, latest_updated_at), ADD INDEX terms_number (term, number),
  ADD INDEX terms_title (term, title), ADD INDEX terms_state (term, latest_status, latest_updated_at)`;
const BACKFILL_CHUNK = 5000;

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  const db = qi.sequelize;
  await db.query(`CREATE TABLE calc_search_terms (
    calc_id INT UNSIGNED NOT NULL,
    term VARCHAR(${TERM_LENGTH}) NOT NULL,
    project_id INT UNSIGNED NOT NULL,
    latest_status ENUM(${STATES}) NULL,
    latest_updated_at DATETIME(3) NULL,
    number VARCHAR(40) NOT NULL,
    title VARCHAR(200) NOT NULL,
    PRIMARY KEY (calc_id, term)
  ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  for (const [name, body] of Object.entries(TRIGGERS)) await db.query(`CREATE TRIGGER ${name} ${body}`);
  // Existing calcs in chunks (a library of 100,000 is about six million rows), then the indexes
  // built once over the whole table, which is several times faster than growing them row by row.
  const [[{ top }]] = (await db.query('SELECT COALESCE(MAX(id), 0) AS top FROM calcs')) as [{ top: number }[], unknown];
  for (let from = 0; from < Number(top); from += BACKFILL_CHUNK)
    await db.query(
      `${INSERT} ${termRows('c', 'calcs c JOIN ')} WHERE c.id > ${from} AND c.id <= ${from + BACKFILL_CHUNK}`,
    );
  await db.query(`ALTER TABLE calc_search_terms ${INDEXES}`);
  // Nothing reads the full-text index any more, and every change of a calc's words paid for it.
  await db.query('ALTER TABLE calcs DROP INDEX calcs_search');
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('ALTER TABLE calcs ADD FULLTEXT INDEX calcs_search (search_text)');
  for (const name of Object.keys(TRIGGERS)) await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${name}`);
  await qi.sequelize.query('DROP TABLE calc_search_terms');
}

import type { QueryInterface } from 'sequelize';

/**
 * A revision's input, result and checklist are JSON texts of 1–30 kB that compress about tenfold.
 * MariaDB's column compression (zlib, per value) stores them so; reads and writes see plain text,
 * and the content hash, computed over the parsed JSON, is unaffected.
 */
const COLUMNS = ['input LONGTEXT NOT NULL', 'result LONGTEXT NULL', 'checklist LONGTEXT NULL'];

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(
    `ALTER TABLE revisions ${COLUMNS.map((c) => `MODIFY ${c.replace('LONGTEXT', 'LONGTEXT COMPRESSED')}`).join(', ')}`,
  );
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`ALTER TABLE revisions ${COLUMNS.map((c) => `MODIFY ${c}`).join(', ')}`);
}

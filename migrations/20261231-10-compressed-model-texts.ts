import type { QueryInterface } from 'sequelize';

/**
 * The checker's independent model keeps JSON texts as a revision does (its input, the server's result and
 * checklist for it, the comparison), of 1–40 kB, stored compressed like the revision's (20261220-0304): MariaDB's
 * column compression (zlib, per value). Reads and writes see plain text; the model hash, computed over the parsed
 * JSON, is unaffected.
 */
const COLUMNS = [
  'input LONGTEXT NOT NULL',
  'result LONGTEXT NULL',
  'checklist LONGTEXT NULL',
  'comparison LONGTEXT NULL',
];

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(
    `ALTER TABLE independent_models ${COLUMNS.map((c) => `MODIFY ${c.replace('LONGTEXT', 'LONGTEXT COMPRESSED')}`).join(', ')}`,
  );
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`ALTER TABLE independent_models ${COLUMNS.map((c) => `MODIFY ${c}`).join(', ')}`);
}

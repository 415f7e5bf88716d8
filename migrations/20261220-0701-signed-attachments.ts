import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Attachments become part of what a signature covers. Content format 1 is what was hashed before
 * (no attachments); format 2 adds the attachment set. Existing rows keep format 1 so their
 * signatures verify exactly as they did; each signature keeps the attachment set it covered.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('revisions', 'content_format', {
    type: DataTypes.TINYINT.UNSIGNED,
    allowNull: false,
    defaultValue: 1,
  });
  await qi.addColumn('signatures', 'content_format', {
    type: DataTypes.TINYINT.UNSIGNED,
    allowNull: false,
    defaultValue: 1,
  });
  await qi.addColumn('signatures', 'attachments', { type: DataTypes.TEXT, allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('signatures', 'attachments');
  await qi.removeColumn('signatures', 'content_format');
  await qi.removeColumn('revisions', 'content_format');
}

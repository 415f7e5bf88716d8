import { DataTypes, type QueryInterface } from 'sequelize';

const time = (allowNull = false) => ({ type: DataTypes.DATE(3), allowNull });
const ref = (model: string) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull: false,
  references: { model, key: 'id' },
  onDelete: 'RESTRICT',
});

/**
 * Per-person mail choices and the files attached to calc revisions. A missing preference row
 * means "send": people hear of hand-overs unless they opt out. The file bytes live in object
 * storage under their SHA-256; this table holds what the record needs to find and trust them.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('mail_preferences', {
    user_id: { ...ref('users'), primaryKey: true },
    event: { type: DataTypes.STRING(40), allowNull: false, primaryKey: true },
    enabled: { type: DataTypes.BOOLEAN, allowNull: false },
    updated_at: time(),
  });

  await qi.createTable('attachments', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    revision_id: ref('revisions'),
    kind: { type: DataTypes.ENUM('drawing', 'material-certificate', 'other'), allowNull: false },
    file_name: { type: DataTypes.STRING(255), allowNull: false },
    media_type: { type: DataTypes.STRING(120), allowNull: false },
    size_bytes: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    storage_key: { type: DataTypes.STRING(200), allowNull: false },
    note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    uploaded_by: ref('users'),
    uploaded_by_name: { type: DataTypes.STRING(120), allowNull: false },
    created_at: time(),
  });
  await qi.addIndex('attachments', ['revision_id', 'kind']);
  await qi.addIndex('attachments', ['sha256']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('attachments');
  await qi.dropTable('mail_preferences');
}

import { DataTypes, type QueryInterface } from 'sequelize';

// The roles as they were when this migration was written; migrations never import live code,
// so a later change to the app's roles cannot rewrite history (a new role needs a new migration).
const ROLES = ['author', 'checker', 'approver', 'compliance', 'admin'] as const;

/**
 * Requests to give a person a signing role. The role takes effect only when a second person
 * (admin or compliance, neither the requester nor the grantee) confirms it. Rows are kept as
 * the record of who asked and who decided.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('role_grants', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
    status: {
      type: DataTypes.ENUM('pending', 'confirmed', 'refused', 'withdrawn'),
      allowNull: false,
      defaultValue: 'pending',
    },
    requested_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    decided_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' } },
    decided_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('role_grants', ['status', 'user_id']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('role_grants');
}

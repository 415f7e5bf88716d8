import { DataTypes, type QueryInterface } from 'sequelize';

// The roles as they were when this migration was written; migrations never import live code,
// so a later change to the app's roles cannot rewrite history (a new role needs a new migration).
const ROLES = ['author', 'checker', 'approver', 'compliance', 'admin'] as const;

const now = { type: DataTypes.DATE(3), allowNull: false };

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'users',
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        username: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        display_name: { type: DataTypes.STRING(120), allowNull: false },
        email: { type: DataTypes.STRING(190), allowNull: false },
        password_hash: { type: DataTypes.STRING(255), allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        last_sign_in_at: { type: DataTypes.DATE(3), allowNull: true },
        password_changed_at: { type: DataTypes.DATE(3), allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        created_at: now,
        updated_at: now,
      },
      { transaction },
    );
    await qi.createTable(
      'user_roles',
      {
        user_id: {
          type: DataTypes.INTEGER.UNSIGNED,
          primaryKey: true,
          references: { model: 'users', key: 'id' },
          onDelete: 'RESTRICT',
        },
        role: { type: DataTypes.ENUM(...ROLES), primaryKey: true },
      },
      { transaction },
    );
    await qi.createTable(
      'projects',
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        code: { type: DataTypes.STRING(32), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        client: { type: DataTypes.STRING(160), allowNull: false, defaultValue: '' },
        description: { type: DataTypes.TEXT, allowNull: false },
        revision_scheme: { type: DataTypes.ENUM('letters', 'numbers'), allowNull: false, defaultValue: 'letters' },
        status: { type: DataTypes.ENUM('active', 'archived'), allowNull: false, defaultValue: 'active' },
        created_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' } },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        created_at: now,
        updated_at: now,
      },
      { transaction },
    );
    await qi.createTable(
      'sessions',
      {
        sid: { type: DataTypes.STRING(64), primaryKey: true },
        expires: { type: DataTypes.DATE, allowNull: true },
        data: { type: DataTypes.TEXT('medium'), allowNull: true },
        user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await qi.addIndex('sessions', ['user_id'], { transaction });
    await qi.addIndex('sessions', ['expires'], { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    for (const table of ['sessions', 'projects', 'user_roles', 'users']) await qi.dropTable(table, { transaction });
  });
}

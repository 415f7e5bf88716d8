import { DataTypes, type QueryInterface } from 'sequelize';

/** A time-based one-time-code secret per user, and an admin's demand that a person use one to sign. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('users', 'totp_secret', { type: DataTypes.STRING(64), allowNull: true });
  await qi.addColumn('users', 'totp_required', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('users', 'totp_required');
  await qi.removeColumn('users', 'totp_secret');
}

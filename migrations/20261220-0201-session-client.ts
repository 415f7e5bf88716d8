import { DataTypes, type QueryInterface } from 'sequelize';

/** Where and with what each session signed in, so a person can recognise and end their sessions. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  // 100 characters hold any textual IPv6 address, with a zone index.
  await qi.addColumn('sessions', 'ip', { type: DataTypes.STRING(100), allowNull: true });
  await qi.addColumn('sessions', 'user_agent', { type: DataTypes.STRING(400), allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('sessions', 'user_agent');
  await qi.removeColumn('sessions', 'ip');
}

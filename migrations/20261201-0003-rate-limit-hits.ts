import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Hit counters for rate limits (sign-in attempts per account and address), kept in MariaDB so
 * every app instance counts against the same limit. One DDL statement each way: MariaDB commits
 * DDL implicitly, so a transaction would add nothing here.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('rate_limit_hits', {
    rate_key: { type: DataTypes.STRING(191), primaryKey: true },
    hits: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    reset_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('rate_limit_hits', ['reset_at']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('rate_limit_hits');
}

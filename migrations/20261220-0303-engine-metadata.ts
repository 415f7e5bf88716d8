import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Units and formulas of every result field, once per engine version. Stored results leave them
 * out (they were the same few kilobytes in every row) and get them back from here when read.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('engine_metadata', {
    engine_version: { type: DataTypes.STRING(40), primaryKey: true },
    fields: { type: DataTypes.TEXT('long'), allowNull: false },
    methods: { type: DataTypes.TEXT('long'), allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('engine_metadata');
}

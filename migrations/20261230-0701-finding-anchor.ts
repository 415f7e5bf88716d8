import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * A finding is anchored where it belongs: a checklist row (clause_ref plus the row's location, e.g.
 * `segments[1]`) or a named input (`segments[1].od`) with no clause. Existing findings keep no anchor.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('findings', 'anchor_path', { type: DataTypes.STRING(200), allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('findings', 'anchor_path');
}

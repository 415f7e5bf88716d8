import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The checker's independent model of a revision (alternate calculation): their own calc input, the
 * server's result and checklist for it, and, once locked, the comparison with the author's model.
 * One per revision: a new revision starts a new comparison. A locked row is never changed again.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  const longText = (allowNull: boolean) => ({ type: DataTypes.TEXT('long'), allowNull });
  await qi.createTable('independent_models', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'revisions', key: 'id' } },
    checker_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    input: longText(false),
    result: longText(true),
    checklist: longText(true),
    verdict: { type: DataTypes.STRING(20), allowNull: true },
    locked_at: { type: DataTypes.DATE(3), allowNull: true },
    model_hash: { type: DataTypes.CHAR(64), allowNull: true },
    author_hash: { type: DataTypes.CHAR(64), allowNull: true },
    comparison: longText(true),
    agrees: { type: DataTypes.BOOLEAN, allowNull: true },
    finding_ids: { type: DataTypes.TEXT, allowNull: true },
    lock_version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('independent_models', ['revision_id'], { unique: true, name: 'independent_models_revision' });
  await qi.addIndex('independent_models', ['checker_id'], { name: 'independent_models_checker' });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('independent_models');
}

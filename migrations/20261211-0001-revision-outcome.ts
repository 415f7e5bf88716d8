import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';
import { outcomeOf } from '../shared/schemas/outcome';

/** A compact verdict summary per revision, so impact analysis reads kilobytes, not megabytes. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('revisions', 'outcome', { type: DataTypes.TEXT, allowNull: true });
  const rows = await qi.sequelize.query<{ id: number; checklist: string | null }>(
    'SELECT id, checklist FROM revisions WHERE checklist IS NOT NULL', { type: QueryTypes.SELECT },
  );
  for (const row of rows) {
    const outcome = JSON.stringify(outcomeOf(JSON.parse(row.checklist!)));
    await qi.sequelize.query('UPDATE revisions SET outcome = ? WHERE id = ?', { replacements: [outcome, row.id] });
  }
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('revisions', 'outcome');
}

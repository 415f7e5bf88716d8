import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

interface RowLike {
  clauseId: string;
  severity: string;
  status: string;
  location?: { label?: string };
}

/**
 * The outcome summary as shared/schemas/outcome.ts computed it when this migration was written.
 * Copied, not imported: a migration replays history, so later changes to the app must not alter it.
 */
type Outcome = { verdict: string | null; failing: string[] };

function outcomeOf(checklist: { verdict: string; rows: RowLike[] } | null): Outcome {
  if (!checklist) return { verdict: null, failing: [] };
  const failing = checklist.rows
    .filter((r) => r.severity === 'mandatory' && (r.status === 'fail' || r.status === 'error'))
    .map((r) => `${r.clauseId}|${r.location?.label ?? ''}|${r.status}`);
  return { verdict: checklist.verdict, failing };
}

/** A compact verdict summary per revision, so impact analysis reads kilobytes, not megabytes. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('revisions', 'outcome', { type: DataTypes.TEXT, allowNull: true });
  // The backfill is data only, so one transaction holds it (the DDL above commits implicitly): all rows or none.
  await qi.sequelize.transaction(async (transaction) => {
    const rows = await qi.sequelize.query<{ id: number; checklist: string | null }>(
      'SELECT id, checklist FROM revisions WHERE checklist IS NOT NULL',
      { type: QueryTypes.SELECT, transaction },
    );
    for (const row of rows) {
      const outcome = JSON.stringify(outcomeOf(JSON.parse(row.checklist!)));
      await qi.sequelize.query('UPDATE revisions SET outcome = ? WHERE id = ?', {
        replacements: [outcome, row.id],
        transaction,
      });
    }
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('revisions', 'outcome');
}

import { QueryTypes, type Sequelize } from 'sequelize';

/* Reading what the app asks MariaDB and how MariaDB plans it (EXPLAIN), for the index specs. */

/** Every SELECT the app sends while `fn` runs, as MariaDB receives it (Sequelize inlines replacements). */
export async function capturedSelects(sequelize: Sequelize, fn: () => Promise<unknown>): Promise<string[]> {
  const seen: string[] = [];
  const options = (sequelize as unknown as { options: { logging: unknown } }).options;
  const before = options.logging;
  options.logging = (sql: string) => {
    const text = sql.replace(/^Executing \([^)]*\): /, '');
    if (/^\s*SELECT/i.test(text)) seen.push(text);
  };
  try {
    await fn();
  } finally {
    options.logging = before;
  }
  return seen;
}

export interface PlanRow {
  table: string | null;
  type: string | null;
  key: string | null;
  rows: number | null;
  Extra: string | null;
}

/** The plan rows that read a large table from end to end (type ALL over 1,000 rows or more). */
export async function fullScans(sequelize: Sequelize, sql: string): Promise<PlanRow[]> {
  const plan = await sequelize.query<PlanRow>(`EXPLAIN ${sql}`, { type: QueryTypes.SELECT });
  // A derived table is the capped count's own bounded result (at most 10,001 rows), not a stored table.
  return plan.filter((r) => r.type === 'ALL' && Number(r.rows) >= 1000 && !r.table?.startsWith('<derived'));
}

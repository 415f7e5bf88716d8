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

/**
 * The plan rows that read a large table from end to end (type ALL over 1,000 rows or more), or that sort what a
 * join of 1,000 rows or more gave before a page of it is kept: a small table read first and joined to a large one
 * by index still reads the large one whole ("Using filesort" on the first row, the rows multiplying to the table).
 */
export async function fullScans(sequelize: Sequelize, sql: string): Promise<PlanRow[]> {
  const plan = await sequelize.query<PlanRow & { id: number | null }>(`EXPLAIN ${sql}`, { type: QueryTypes.SELECT });
  // A derived table is the capped count's own bounded result (at most 1,001 rows), not a stored table. The kept
  // counts (`calc_counts`) hold a row per project and state, not per calc: the whole library's total sums
  // them all by design, a read that grows with the projects, never with the calcs.
  const stored = plan.filter((r) => !r.table?.startsWith('<derived') && r.table !== 'calc_counts');
  const scans = stored.filter((r) => r.type === 'ALL' && Number(r.rows) >= 1000);
  const sorted = stored.filter((r) => r.Extra?.includes('Using filesort'));
  const joined = (id: number | null) =>
    stored.filter((r) => r.id === id).reduce((product, r) => product * Math.max(1, Number(r.rows) || 1), 1);
  return [...scans, ...sorted.filter((r) => !scans.includes(r) && joined(r.id) >= 1000)];
}

import { plainSelect } from '../db/plain-query';
import type { Sequelize } from 'sequelize';
import { AppError } from '../errors/app-error';

/**
 * Keyset paging: a page starts after the sort values of the previous page's last row, so the
 * database walks an index from there instead of counting past every earlier row as OFFSET does.
 * A column may have an ordered domain (an ENUM sorts by its declared order, not alphabetically):
 * then "after" is the list of later values, which the index still serves as ranges.
 */
export interface KeyColumn {
  sql: string;
  domain?: readonly string[];
  isDate?: boolean;
}

type KeyValue = string | number;

export function encodeCursor(values: KeyValue[]): string {
  return Buffer.from(JSON.stringify(values)).toString('base64url');
}

/**
 * A cursor's value for its column: one of a state's values, a time as the lists write it (a time that is no date
 * compared as text and answered an empty page), or a string or number.
 */
function fitsColumn(column: KeyColumn, v: unknown): boolean {
  if (column.domain) return column.domain.includes(v as string);
  if (column.isDate) return typeof v === 'string' && /^\d{4}-\d{2}-\d{2}T/.test(v) && !Number.isNaN(Date.parse(v));
  return typeof v === 'string' || typeof v === 'number';
}

export function decodeCursor(cursor: string, columns: KeyColumn[]): KeyValue[] {
  let values: unknown;
  try {
    values = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8'));
  } catch {
    values = null;
  }
  const fits =
    Array.isArray(values) && values.length === columns.length && values.every((v, i) => fitsColumn(columns[i], v));
  if (!fits)
    throw new AppError('validation', 400, 'The page cursor is not valid for this list', {
      fieldErrors: { after: ['is not a page cursor of this list; start from the first page'] },
    });
  return values as KeyValue[];
}

/** `(a, b, id) > (x, y, z)` spelled as ORs of equalities and one inequality, which MariaDB turns into index ranges. */
export function keysetCondition(
  columns: KeyColumn[],
  values: KeyValue[],
  dir: 'asc' | 'desc',
): { sql: string; replacements: unknown[] } {
  const ors: string[] = [];
  const replacements: unknown[] = [];
  const value = (i: number) => (columns[i].isDate ? new Date(values[i] as string) : values[i]);
  columns.forEach((col, i) => {
    const parts = columns.slice(0, i).map((c) => `${c.sql} = ?`);
    const params: unknown[] = columns.slice(0, i).map((_, k) => value(k));
    if (col.domain) {
      const at = col.domain.indexOf(values[i] as string);
      const later = dir === 'asc' ? col.domain.slice(at + 1) : col.domain.slice(0, at);
      if (later.length === 0) return;
      parts.push(`${col.sql} IN (${later.map(() => '?').join(', ')})`);
      params.push(...later);
    } else {
      parts.push(`${col.sql} ${dir === 'asc' ? '>' : '<'} ?`);
      params.push(value(i));
    }
    ors.push(`(${parts.join(' AND ')})`);
    replacements.push(...params);
  });
  return { sql: ors.length ? `(${ors.join(' OR ')})` : 'FALSE', replacements };
}

export const orderBy = (columns: KeyColumn[], dir: 'asc' | 'desc') =>
  columns.map((c) => `${c.sql} ${dir.toUpperCase()}`).join(', ');

/**
 * How far a total is counted when it must walk the rows (audit filters, queues, searches; the plain calc list's totals
 * are kept exact, see calc-list.ts): past a thousand the figure tells a reader nothing a pager needs, and counting ten
 * times further was most of MariaDB's work for such a page (1.4 of 1.9 ms for the audit trail's first page).
 */
export const TOTAL_CAP = 1_000;

/** A count of `FROM … WHERE …` stopping one past `cap`, as a scalar subquery: a bounded walk, however broad. */
export const cappedCountSql = (fromWhere: string, cap = TOTAL_CAP) =>
  `(SELECT COUNT(*) FROM (SELECT 1 ${fromWhere} LIMIT ${cap + 1}) counted)`;

/** What a count that stopped one past `cap` says: the number, or the cap and "at least" past it. */
export const cappedTotal = (n: number, cap = TOTAL_CAP): { total: number; totalIsAtLeast: boolean } =>
  n > cap ? { total: cap, totalIsAtLeast: true } : { total: n, totalIsAtLeast: false };

/**
 * Counts the rows of a filter, but stops at TOTAL_CAP + 1 so that a broad filter over a million
 * rows costs a bounded index walk; past the cap the answer is "at least 1,000".
 */
export async function cappedCount(
  sequelize: Sequelize,
  fromWhere: string,
  replacements: unknown[],
  cap = TOTAL_CAP,
): Promise<{ total: number; totalIsAtLeast: boolean }> {
  const [row] = await plainSelect<{ n: number }>(
    sequelize,
    `SELECT ${cappedCountSql(fromWhere, cap)} AS n`,
    replacements,
  );
  return cappedTotal(Number(row.n), cap);
}

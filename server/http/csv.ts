import { stringify } from 'csv-stringify/sync';

/**
 * One column of a CSV export. `numeric` columns write numbers as numbers (a spreadsheet can sum
 * them, and a number can never be a formula); every other cell is text and is neutralised.
 */
export interface CsvColumn<T> {
  /** Names the unit where there is one, e.g. "approved at (UTC, ISO 8601)". */
  header: string;
  value: (row: T) => string | number | Date | null | undefined;
  numeric?: boolean;
}

// OWASP "CSV Injection": a cell starting with one of these may run as a formula when opened.
const FORMULA_START = /^[=+\-@\t\r]/;

/** A text cell a spreadsheet shows as text: a leading single quote before a formula trigger. */
export function neutralise(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** Dates as ISO 8601 in UTC (e.g. 2026-12-02T04:30:00.000Z), whatever the server's zone. */
export const isoUtc = (d: Date | string | null | undefined): string => (d == null ? '' : new Date(d).toISOString());

function cell<T>(column: CsvColumn<T>, row: T): string | number {
  const v = column.value(row);
  if (v == null) return '';
  if (v instanceof Date) return isoUtc(v);
  if (column.numeric && typeof v === 'number' && Number.isFinite(v)) return v;
  return neutralise(String(v));
}

/**
 * A CSV file (RFC 4180, CRLF, every text cell quoted) written by csv-stringify: a header row,
 * the rows, and optional closing lines (summary, caution) after a blank line. Closing lines are
 * ours, but they are neutralised all the same.
 */
export function toCsv<T>(
  columns: readonly CsvColumn<T>[],
  rows: readonly T[],
  closing: readonly string[] = [],
): string {
  const options = { record_delimiter: 'windows' as const, quoted_string: true, quoted_empty: true };
  const body = stringify(
    [columns.map((c) => neutralise(c.header)), ...rows.map((r) => columns.map((c) => cell(c, r)))],
    options,
  );
  if (closing.length === 0) return body;
  return `${body}\r\n${stringify(
    closing.map((line) => [neutralise(line)]),
    options,
  )}`;
}

import type { SignalRow } from '../../shared/schemas/review-health.schema';
import { AppError } from '../errors/app-error';
import { decodeCursor, encodeCursor, keysetCondition, type KeyColumn } from '../http/keyset';

/** What a signal is asked for: `size` rows (null: every row, for the CSV export) after a cursor of its own. */
export interface PageAsk {
  size: number | null;
  after: string | null;
}

/** Rows of one signal, how many there are from the cursor on, and where the next page starts. */
export interface Listed {
  rows: SignalRow[];
  total: number;
  next: string | null;
}

/** `LIMIT size + 1` (the extra row says there is a next page), or nothing when every row is asked for. */
export const limitOf = (ask: PageAsk): string => (ask.size === null ? '' : `LIMIT ${ask.size + 1}`);

/**
 * The keyset condition after the cursor (`TRUE` on the first page): the sort columns in order, the last being
 * unique. All columns run in `dir`, so the index walks on from where the previous page stopped.
 */
export function afterCursor(
  ask: PageAsk,
  columns: KeyColumn[],
  dir: 'asc' | 'desc',
): { sql: string; replacements: unknown[] } {
  if (!ask.after) return { sql: 'TRUE', replacements: [] };
  return keysetCondition(columns, decodeAfter(ask.after, columns), dir);
}

const badCursor = () =>
  new AppError('validation', 400, 'The page cursor is not valid for this list', {
    fieldErrors: { after: ['is not a page cursor of this list; start from the first page'] },
  });

/** The cursor's values, each date a real instant (a made-up cursor is a 400, never an invalid date in SQL). */
export function decodeAfter(after: string, columns: KeyColumn[]): (string | number)[] {
  const values = decodeCursor(after, columns);
  if (columns.some((c, i) => c.isDate && Number.isNaN(Date.parse(String(values[i]))))) throw badCursor();
  return values;
}

/** Cuts the extra row off a keyset page and makes the cursor from the last row kept. */
export function keysetPage<T>(
  found: T[],
  ask: PageAsk,
  keyOf: (row: T) => (string | number)[],
): { rows: T[]; next: string | null } {
  if (ask.size === null || found.length <= ask.size) return { rows: found, next: null };
  const rows = found.slice(0, ask.size);
  return { rows, next: encodeCursor(keyOf(rows[rows.length - 1])) };
}

/** The COUNT(*) OVER () column every row of a paged query carries, or 0 when there are no rows. */
export const totalOf = (found: { total?: number | string }[]): number => Number(found[0]?.total ?? 0);

const POSITION: KeyColumn[] = [{ sql: 'position' }];

/**
 * A page of a list worked out in memory (one row per person, so it is bounded by the people who sign): the
 * cursor is the position after the last row shown.
 */
export function memoryPage(all: SignalRow[], ask: PageAsk): Listed {
  const start = ask.after ? Number(decodeCursor(ask.after, POSITION)[0]) : 0;
  if (!Number.isInteger(start) || start < 0) throw badCursor();
  const end = ask.size === null ? all.length : start + ask.size;
  return {
    rows: all.slice(start, end),
    total: Math.max(0, all.length - start),
    next: end < all.length ? encodeCursor([end]) : null,
  };
}

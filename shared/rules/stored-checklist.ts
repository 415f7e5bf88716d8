import type { Checklist, ChecklistRow, RowLocation } from './checklist-types';

/*
 * The stored form of a checklist, shared by the server (which keeps it in a revision row) and the browser (which may
 * be sent it as stored and builds the rows back itself). Each row is an array of its values in the order below, with
 * every text (clause title, reference, location label, message…) written once in `storedRows.strings` and named by
 * its index: a row's clause texts repeat at every location, its location texts under every clause. Everything else is
 * kept as the evaluator returned it, and `rows` stays an array of one entry per row (SQL reads its length).
 * Decoding builds each row back with the same keys in the same order, so the checklist is deep-equal to the
 * evaluator's and content hashes are unchanged. A checklist whose rows do not have exactly this shape is kept whole,
 * and rows kept whole (before this form) are decoded as they are.
 */
type Kind = 'text' | 'text?' | 'number?' | 'texts' | { [key: string]: Kind };

const LOCATION: Record<keyof RowLocation, Kind> = { scope: 'text', index: 'number?', at: 'number?', label: 'text' };

// Key order is the evaluator's (checklist-row.ts); a spec holds the two to the same order.
const ROW: Record<keyof ChecklistRow, Kind> = {
  clauseId: 'text',
  clauseTitle: 'text',
  reference: 'text',
  severity: 'text',
  status: 'text',
  location: LOCATION,
  actual: 'number?',
  limit: 'number?',
  unit: 'text',
  utilisation: 'number?',
  utilisationBasis: 'text?',
  message: 'text',
  warnings: 'texts',
};

/** Form 1: the columns of ROW above. A change of columns is a new form; older forms must still be read. */
const FORM = 1;

type Cell = string | number | null | Cell[];

/** A checklist as stored: rows as arrays of cells, texts written once. */
export type StoredChecklist = Omit<Checklist, 'rows'> & {
  rows: unknown[];
  storedRows?: { form: number; strings: string[] };
};

class Misfit extends Error {}

function encode(value: unknown, kind: Kind, ref: (s: string) => number): Cell {
  if (kind === 'number?' && (value === null || typeof value === 'number')) return value;
  if (kind === 'text?' && value === null) return null;
  if ((kind === 'text' || kind === 'text?') && typeof value === 'string') return ref(value);
  if (kind === 'texts' && Array.isArray(value)) return value.map((v) => encode(v, 'text', ref));
  if (typeof kind === 'object' && value !== null && typeof value === 'object' && !Array.isArray(value)) {
    const keys = Object.keys(kind);
    const own = Object.keys(value);
    if (own.length !== keys.length || own.some((k, i) => k !== keys[i])) throw new Misfit();
    return keys.map((k) => encode((value as Record<string, unknown>)[k], kind[k], ref));
  }
  throw new Misfit();
}

function decode(cell: Cell, kind: Kind, strings: readonly string[]): unknown {
  if (kind === 'number?' || cell === null) return cell;
  if (kind === 'text' || kind === 'text?') return strings[cell as number];
  if (kind === 'texts') return (cell as number[]).map((i) => strings[i]);
  const cells = cell as Cell[];
  const out: Record<string, unknown> = {};
  Object.keys(kind).forEach((k, i) => (out[k] = decode(cells[i], kind[k], strings)));
  return out;
}

/** The stored form of a checklist; one whose rows do not fit the form is kept whole. */
export function encodeChecklist(checklist: Checklist): StoredChecklist {
  const strings: string[] = [];
  const index = new Map<string, number>();
  const ref = (s: string): number => {
    let i = index.get(s);
    if (i === undefined) index.set(s, (i = strings.push(s) - 1));
    return i;
  };
  let rows: Cell[];
  try {
    rows = checklist.rows.map((r) => encode(r, ROW, ref));
  } catch (err) {
    if (err instanceof Misfit) return checklist;
    throw err;
  }
  return { ...checklist, rows, storedRows: { form: FORM, strings } };
}

/** A stored checklist as the evaluator returned it; a whole (older) one as it is. */
export function decodeChecklist(stored: StoredChecklist): Checklist {
  if (stored.storedRows === undefined) return stored as Checklist;
  const { storedRows, ...rest } = stored;
  if (storedRows.form !== FORM) throw new Error(`Stored checklist rows are in unknown form ${storedRows.form}`);
  return { ...rest, rows: rest.rows.map((r) => decode(r as Cell, ROW, storedRows.strings) as ChecklistRow) };
}

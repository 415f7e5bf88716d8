import { plainSelect, plainSelectWarned } from '../db/plain-query';
import type { Sequelize } from 'sequelize';
import { TOTAL_CAP, cappedCountSql, cappedTotal, keysetCondition, orderBy, type KeyColumn } from '../http/keyset';
import {
  CALC_ROW_COLUMNS,
  CALC_ROW_JOINS,
  CALC_ROW_SQL,
  keyOf,
  sortColumns,
  type CalcRow,
  type CalcSort,
} from './calc-list-rows';
import { SEARCH_LIMITS, chooseDriver, matchJoins, type Driver, type SearchFilter } from './calc-search-plan';

type KeyValue = string | number;

export interface SearchRequest {
  words: string[];
  filter: SearchFilter;
  sort: CalcSort;
  dir: 'asc' | 'desc';
  size: number;
  after: KeyValue[] | null;
}

export interface SearchPage {
  rows: CalcRow[];
  next: KeyValue[] | null;
  /** The page stopped after SEARCH_LIMITS.pageBudget candidates without filling up; `next` searches on. */
  stoppedEarly: boolean;
  counted: { total: number; totalIsAtLeast: boolean } | null;
}

interface Candidate {
  id: number;
  key: KeyValue[];
  /** The candidate satisfies every word and filter. */
  ok: boolean;
}

/**
 * Whether a candidate satisfies the rest of the search, as look-ups by primary key joined to the walk itself (a few
 * per candidate), leaving out what the driver's own condition holds (calc-search-plan.ts, `matchJoins`).
 */
function matchOf(d: Driver, r: SearchRequest, inner = false): Match {
  // The list's own rows: the driver's condition is the filter, so only the words are left.
  if (!d.term) return matchJoins(r.words, {}, 'c.id', undefined, inner);
  return matchJoins(r.words, r.filter, d.columns[d.columns.length - 1].sql, d.term, inner);
}

type Match = ReturnType<typeof matchJoins>;

interface Chunk {
  /** The candidates of the chunk that satisfy every word and filter, in the list's order. */
  matches: Candidate[];
  /** The chunk's last candidate when it read all `limit` it asked for (where the next chunk starts), else null. */
  last: KeyValue[] | null;
}

/**
 * The next `limit` candidates of the driver after `after`, in the list's order, from its index alone, each checked
 * as it is read: one statement per chunk. Only the matches travel back, with the chunk's last candidate when the walk
 * filled the chunk; a broad word used to send every candidate to the app to be parsed and dropped (on 100,000 calcs a
 * two-word search read up to 2,000 rows to show 50, and its app CPU went mostly to that). The candidates are numbered
 * but not counted: a count over the window (`COUNT(*) OVER ()`) cost MariaDB 0.2 of a chunk's 1.6 ms, and whether the
 * walk filled the chunk is told by its `limit`-th candidate alone.
 */
async function candidates(
  db: Sequelize,
  d: Driver,
  r: SearchRequest,
  after: KeyValue[] | null,
  limit: number,
): Promise<Chunk> {
  // With calcs from two sources, the match is checked on the merged walk's candidates, as they are numbered.
  const match = matchOf(d.moved ? { ...d, columns: keyAliases(d, 'y') } : d, r);
  const walk = walkSql(d, r.dir, after, limit, d.moved ? undefined : match);
  const ok = d.moved ? `, ${match.ok} AS ok` : '';
  const joins = d.moved ? match.joins : '';
  // The chunk's rows keep their column types (an ENUM still sorts by its declared order), so numbering them in
  // the same order finds the last one.
  const numbered = orderBy(keyAliases(d, 'y'), r.dir);
  const rows = await plainSelect<Record<string, string | number | Date>>(
    db,
    `SELECT * FROM (SELECT y.*${ok}, ROW_NUMBER() OVER (ORDER BY ${numbered}) AS rn
        FROM (${walk.sql}) y ${joins}) z WHERE z.ok = 1 OR z.rn = ${limit} ORDER BY z.rn`,
    d.moved ? [...walk.params, ...match.params] : walk.params,
  );
  const list = rows.map((row): Candidate & { rn: number } => {
    const key = keyOfRow(d, row);
    return { id: Number(key[key.length - 1]), key, ok: Number(row.ok) === 1, rn: Number(row.rn) };
  });
  const end = list.length ? list[list.length - 1] : null;
  return { matches: list.filter((c) => c.ok), last: end?.rn === limit ? end.key : null };
}

/** A walked row's key in the list's order (k0, k1, …; the last the calc id), a time as ISO text. */
const keyOfRow = (d: Driver, row: Record<string, string | number | Date>): KeyValue[] =>
  d.columns.map((c, i) => (c.isDate ? new Date(row[`k${i}`]).toISOString() : row[`k${i}`])) as KeyValue[];

/**
 * The driver's key columns as the walk's output names them (k0, k1, …) on a derived table. A state sorts by its
 * place in the workflow, written out: the merged walk's UNION turns the ENUM into text, which would sort it by name.
 */
const keyAliases = (d: Driver, table: string) =>
  d.columns.map((c, i) => {
    const name = `${table}.k${i}`;
    return { ...c, sql: c.domain ? `FIELD(${name}, ${c.domain.map((v) => `'${v}'`).join(', ')})` : name };
  });

/**
 * The driver's next `limit` candidates after `after`, in the list's order, as key columns k0, k1, … (the last the
 * calc id), with the match as `ok` and its look-ups joined to every source when given. A walk by last change
 * (`moved`) merges two sources: the word's index without the calcs saved since their terms were written, and those
 * calcs from `calc_search_moved` at their true last change, each read no further than `limit`.
 */
function walkSql(
  d: Driver,
  dir: 'asc' | 'desc',
  after: KeyValue[] | null,
  limit: number,
  match?: Match,
): { sql: string; params: unknown[] } {
  const source = (columns: KeyColumn[], from: string, where: string[], params: unknown[]) => {
    const all = [...where];
    const values = [...params];
    if (after) {
      const k = keysetCondition(columns, after, dir);
      all.push(k.sql);
      values.push(...k.replacements);
    }
    const keys = columns.map((c, i) => `${c.sql} AS k${i}`).join(', ');
    const ok = match ? `, ${match.ok} AS ok` : '';
    return {
      sql: `SELECT ${keys}${ok} FROM ${from} ${match?.joins ?? ''} WHERE ${all.join(' AND ')}
        ORDER BY ${orderBy(columns, dir)} LIMIT ${limit}`,
      params: [...(match?.params ?? []), ...values],
    };
  };
  if (!d.moved) return source(d.columns, d.from, d.where, d.params);
  const saved = d.columns.map((c) => (c.sql === 't.latest_updated_at' ? { ...c, sql: 'm.latest_updated_at' } : c));
  const indexed = source(d.columns, d.from, [...d.where, `NOT EXISTS (${MOVED_ROW} m.calc_id = t.calc_id)`], d.params);
  const moved = source(
    saved,
    `calc_search_moved m JOIN calc_search_terms t ON t.calc_id = m.calc_id`,
    d.where,
    d.params,
  );
  return {
    sql: `SELECT u.* FROM ((${indexed.sql}) UNION ALL (${moved.sql})) u
      ORDER BY ${orderBy(keyAliases(d, 'u'), dir)} LIMIT ${limit}`,
    params: [...indexed.params, ...moved.params],
  };
}

const MOVED_ROW = 'SELECT 1 FROM calc_search_moved m WHERE';

/**
 * One page of a search: walks the driver's index in the list's order, each chunk of candidates
 * checked against the other words and filters as it is read, and stops once the page (plus one, to know
 * there is more) is full, the candidates run out, or SEARCH_LIMITS.pageBudget were looked at.
 */
export async function searchCalcs(db: Sequelize, r: SearchRequest): Promise<SearchPage> {
  const driver = await chooseDriver(db, r.words, r.filter, r.sort);
  if (driver.isExact) return exactPage(db, driver, r);
  const streamed = await streamedPage(db, driver, r);
  if (streamed) return streamed;
  const found: Candidate[] = [];
  let after = r.after;
  let examined = 0;
  let chunk = firstChunk(driver, r.size + 1);
  let exhausted = false;
  let matched = 0;
  while (found.length <= r.size && examined < SEARCH_LIMITS.pageBudget) {
    const limit = Math.min(chunk, SEARCH_LIMITS.pageBudget - examined);
    const { matches, last } = await candidates(db, driver, r, after, limit);
    for (const c of matches) {
      matched++;
      if (found.length <= r.size) found.push(c);
    }
    // Fewer candidates than asked for: the walk ran out.
    if (!last) {
      exhausted = true;
      break;
    }
    examined += limit;
    after = last;
    chunk = nextChunk(chunk, matched, examined, r.size + 1 - found.length);
  }
  const full = found.length > r.size;
  const shown = found.slice(0, r.size);
  const rows = await rowsOf(db, shown);
  const stoppedEarly = !full && !exhausted;
  const next = full ? shown[shown.length - 1].key : stoppedEarly ? after : null;
  const counted = r.after ? null : countOf(matched, exhausted);
  return { rows, next, stoppedEarly, counted };
}

/**
 * A page of a walked search in one statement with its calcs' rows: the walk joined to its look-ups, so that MariaDB
 * reads candidates in the list's order and stops at the page's last match (plus one), where the chunks checked every
 * candidate of each chunk, numbered them all and cost a statement each, and the rows another (the bench's two-word
 * searches read 569 and 380 candidates in two chunks for a page of 50). It gives up after examining about
 * SEARCH_LIMITS.streamed candidates (`LIMIT … ROWS EXAMINED`, as MariaDB counts rows: the walked entries and their
 * look-ups); cut short, it does not say how far it read, so the page is then walked in chunks from its start, which
 * count their candidates against the page's budget and say where they stopped (null here). A walk merged from two
 * sources sorts what both found only after both ran, so its warnings are read even for a full page.
 */
async function streamedPage(db: Sequelize, d: Driver, r: SearchRequest): Promise<SearchPage | null> {
  // A range the first chunk reads whole is walked in chunks: they count every match in it.
  if (d.size === undefined || d.size <= firstChunk(d, r.size + 1)) return null;
  const match = matchOf(d, r, true);
  const walk = walkSql(d, r.dir, r.after, r.size + 1, match);
  // The page's calcs are read in the same statement, each row a few look-ups more (the calc, its standard, project).
  const examined = Math.min(SEARCH_LIMITS.streamed, SEARCH_LIMITS.pageBudget) * (1 + match.lookups) + 4 * (r.size + 1);
  const { rows, warnings } = await plainSelectWarned<CalcRow>(
    db,
    `${rowsOfWalk(d, r, walk.sql)} LIMIT ${r.size + 1} ROWS EXAMINED ${examined}`,
    walk.params,
    (found) => d.moved === true || found.length <= r.size,
  );
  if (warnings > 0) return null;
  const full = rows.length > r.size;
  const shown = rows.slice(0, r.size);
  return {
    rows: shown,
    next: full ? keyOf(shown[shown.length - 1], r.sort) : null,
    stoppedEarly: false,
    counted: r.after ? null : countOf(rows.length, !full),
  };
}

/**
 * The calcs' rows of a walk's page, in the list's order: its entries carry their calc's sort values (kept by the same
 * triggers, in the same transaction; a last change a save moved, from `calc_search_moved`, see `walkSql`), so the
 * rows sort as the walk.
 */
const rowsOfWalk = (d: Driver, r: SearchRequest, walk: string, extra = '') =>
  `SELECT ${CALC_ROW_COLUMNS}${extra}
    FROM (${walk}) y
    JOIN calcs c ON c.id = y.k${d.columns.length - 1} ${CALC_ROW_JOINS}
    ORDER BY ${orderBy(sortColumns(r.sort, 'c', 'id'), r.dir)}`;

/**
 * The first chunk's size: fourfold the matches wanted, or fewer when the indexes' estimate says most candidates match
 * (a word within a project: "shaft" is in four calcs of five, and 204 candidates were read for a page of 50). Twice
 * what the estimate asks for, since it may be off by half and a second chunk costs more than the candidates spared.
 * It takes the conditions as independent; words typed together tend to come together, so it is not trusted to make
 * the chunk larger (two words in 5 % of calcs each, nearly always together, would read 2,000 for 64).
 */
function firstChunk(d: Driver, wanted: number): number {
  const usual = Math.max(SEARCH_LIMITS.firstChunk, 4 * wanted);
  if (d.share === undefined) return usual;
  return Math.min(usual, Math.ceil((wanted / d.share) * 2));
}

/**
 * The next chunk's size: the candidates the matches still wanted need at the rate seen so far, a quarter more for
 * luck, growing at most fourfold (fourfold while nothing has matched). Growing fourfold whatever the rate read 816
 * candidates where a two-word search needed about 300 more to fill its page.
 */
function nextChunk(previous: number, matched: number, examined: number, wanted: number): number {
  if (matched === 0) return previous * 4;
  const needed = Math.ceil(((wanted * examined) / matched) * 1.25);
  return Math.max(SEARCH_LIMITS.firstChunk, Math.min(previous * 4, needed));
}

async function rowsOf(db: Sequelize, shown: Candidate[]): Promise<CalcRow[]> {
  if (shown.length === 0) return [];
  const rows = await plainSelect<CalcRow>(db, `${CALC_ROW_SQL} WHERE c.id IN (?)`, [shown.map((c) => c.id)]);
  const byId = new Map(rows.map((row) => [Number(row.id), row]));
  return shown.flatMap((c) => byId.get(c.id) ?? []);
}

/**
 * A one-word search with no other condition in one statement: the word's index entries of the page in the list's
 * order, their calcs' rows (`rowsOfWalk`), and on a first page the word's count (index entries alone, up to
 * SEARCH_LIMITS.countCap).
 */
async function exactPage(db: Sequelize, d: Driver, r: SearchRequest): Promise<SearchPage> {
  const cap = SEARCH_LIMITS.countCap;
  const count = r.after
    ? ''
    : `, ${cappedCountSql(`FROM ${d.from} WHERE ${d.where.join(' AND ')}`, cap)} AS listed_total`;
  const walk = walkSql(d, r.dir, r.after, r.size + 1);
  const rows = await plainSelect<CalcRow & { listed_total?: number }>(db, rowsOfWalk(d, r, walk.sql, count), [
    ...(r.after ? [] : d.params),
    ...walk.params,
  ]);
  const shown = rows.slice(0, r.size);
  const next = rows.length > r.size ? keyOf(shown[shown.length - 1], r.sort) : null;
  const counted = r.after ? null : cappedTotal(Number(rows[0]?.listed_total ?? 0), cap);
  return { rows: shown, next, stoppedEarly: false, counted };
}

/**
 * The number of matches of a walk: every match when it ran out of candidates, else "at least" the matches found,
 * since counting further would check every remaining candidate by look-ups in the term table, which a broad word
 * makes tens of thousands. (A one-word search without other conditions counts in its own statement, `exactPage`.)
 */
function countOf(found: number, exhausted: boolean): SearchPage['counted'] {
  return { total: Math.min(found, TOTAL_CAP), totalIsAtLeast: !exhausted || found > TOTAL_CAP };
}

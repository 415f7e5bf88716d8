// Where a search starts: the rarest of its words, or the project's own list when that is smaller.
import { LRUCache } from 'lru-cache';
import { plainSelect } from '../db/plain-query';
import type { Sequelize } from 'sequelize';
import type { RevisionState } from '../../shared/schemas/revision.schema';
import { TOTAL_CAP, type KeyColumn } from '../http/keyset';
import { sortColumns, type CalcSort } from './calc-list-rows';

/** Bounds of one search request; specs lower them to reach each bound with a handful of calcs. */
export const SEARCH_LIMITS = {
  /** Calcs looked at for one page: a page not full by then says so, and its `next` searches on. */
  pageBudget: 2_000,
  /**
   * Candidates a streamed page examines, about (as MariaDB counts the rows it examines: the walked entries and their
   * look-ups), before it gives the page up to the walk in chunks (calc-search.ts, `streamedPage`).
   */
  streamed: 1_000,
  /** Candidates read at once (fewer when most are estimated to match), growing fourfold while the page is not full. */
  firstChunk: 200,
  /** A one-word search counts its matches this far, as every walked total (TOTAL_CAP, "at least 1,000"). */
  countCap: TOTAL_CAP,
};

export interface SearchFilter {
  projectId?: number;
  status?: RevisionState;
}

/** An index walked in the list's order: its candidates, and whether they need checking against the rest. */
export interface Driver {
  from: string;
  where: string[];
  params: unknown[];
  columns: KeyColumn[];
  /**
   * A word's index walked by last change: calcs saved since their terms were written keep their last change in
   * `calc_search_moved`, not in the term rows (migration 20261231-16), so the walk leaves them out of the index and
   * takes them from that table at their true time (calc-search.ts, `walkSql`).
   */
  moved?: boolean;
  /** True when the driver's own condition is the whole search, so every candidate matches. */
  isExact: boolean;
  /** A word's index: the word every candidate has, and whether its condition holds the state filter too. */
  term?: { word: string; hasState: boolean };
  /**
   * The share of its candidates expected to match the rest of the search, from the indexes' estimates of each
   * condition as if they were independent; absent when nothing was estimated (one word and no project).
   */
  share?: number;
  /** The indexes' estimate of the driver's own range (absent when nothing was estimated). */
  size?: number;
}

const TERM_INDEX: Record<CalcSort, string> = {
  number: 'terms_number',
  title: 'terms_title',
  updatedAt: 'terms_updated',
  status: 'terms_state',
};

function termDriver(word: string, words: string[], filter: SearchFilter, sort: CalcSort): Driver {
  // The state index serves a state filter for the two orders that lead with the state or the time.
  const hasState = Boolean(filter.status) && (sort === 'updatedAt' || sort === 'status');
  return {
    from: `calc_search_terms t FORCE INDEX (${hasState ? 'terms_state' : TERM_INDEX[sort]})`,
    where: hasState ? ['t.term = ?', 't.latest_status = ?'] : ['t.term = ?'],
    params: hasState ? [word, filter.status] : [word],
    columns: sortColumns(sort, 't', 'calc_id'),
    moved: sort === 'updatedAt' || sort === 'status',
    isExact: words.length === 1 && !filter.projectId && (!filter.status || hasState),
    term: { word, hasState },
  };
}

/** The list's own filters as SQL on `calcs c` (or on the project and state columns named). */
export function filterConditions(
  filter: SearchFilter,
  columns = { project: 'c.project_id', state: 'c.latest_status' },
): { parts: string[]; params: unknown[] } {
  const parts: string[] = [];
  const params: unknown[] = [];
  if (filter.projectId) {
    parts.push(`${columns.project} = ?`);
    params.push(filter.projectId);
  }
  if (filter.status) {
    parts.push(`${columns.state} = ?`);
    params.push(filter.status);
  }
  return { parts, params };
}

function filterDriver(filter: SearchFilter, sort: CalcSort): Driver {
  const { parts, params } = filterConditions(filter);
  return { from: 'calcs c', where: parts, params, columns: sortColumns(sort, 'c', 'id'), isExact: false };
}

/**
 * Picks where the walk starts: the word (or, with a project, the project's own list) with the fewest calcs, by the
 * index's own estimate of each range (one EXPLAIN, whose row figures come from two dives into each range: exact for
 * a few hundred entries, within a factor of about 2.5 for tens of thousands on the bench's library, in the same
 * order as the true counts). Counting each word's entries up to 2,000 instead read up to 2,000 index entries a word
 * for a choice the estimate makes as well (the bench's multi-word searches: MariaDB 2.5 → 1.6 ms a search), and a
 * tie at the cap went to the longest word ("DRG-4" walked DRG, in every calc, instead of 4). A word no calc has is
 * estimated at one row or none, so its empty range is walked (or one as small) and the answer is empty at once.
 * The same EXPLAIN estimates the calcs in all (and in the state filtered on), from which the driver's `share`.
 * Each range's estimate is kept a minute (`rangeEstimates`), so a search whose ranges were all estimated lately sends
 * no EXPLAIN.
 */
export async function chooseDriver(
  sequelize: Sequelize,
  words: string[],
  filter: SearchFilter,
  sort: CalcSort,
): Promise<Driver> {
  const drivers = words.map((w) => termDriver(w, words, filter, sort));
  if (filter.projectId) drivers.push(filterDriver(filter, sort));
  // One word and no project: nothing to choose between (an unknown word simply walks an empty range).
  if (drivers.length === 1) return drivers[0];
  const ranges = [
    ...drivers,
    { from: 'calcs c', where: ['TRUE'], params: [] as unknown[] },
    ...(filter.status ? [{ from: 'calcs c', where: ['c.latest_status = ?'], params: [filter.status] }] : []),
  ];
  const estimates = await estimateRanges(sequelize, ranges);
  const [calcs, inState, ...sizes] = [drivers.length, drivers.length + 1, ...drivers.keys()].map((i) => estimates[i]);
  // Ties go to the longest word, which is the likelier to be rare.
  const best = sizes
    .map((n, i) => ({ n, i, length: words[i]?.length ?? 0 }))
    .sort((a, b) => a.n - b.n || b.length - a.length)[0];
  return {
    ...drivers[best.i],
    share: matchShare(sizes, best.i, { calcs, inState, drivers, filter }),
    size: best.n,
  };
}

/**
 * Estimates of index ranges, kept per instance: a minute old at most, up to 5,000 ranges (a word, a project, a
 * state). They only choose where a walk starts and how large its first chunk is; the walk reads the index itself, so
 * an estimate a minute stale can make a search slower, never its answer different. Each EXPLAIN cost a round trip and
 * about 0.35 ms of MariaDB's time on every search of two words or within a project (DEVELOPERS.md, "Measuring speed").
 */
const rangeEstimates = new LRUCache<string, number>({ max: 5_000, ttl: 60_000 });

type Range = Pick<Driver, 'from' | 'where' | 'params'>;

/** Each range's estimated rows, those not estimated lately in one EXPLAIN. */
async function estimateRanges(sequelize: Sequelize, ranges: Range[]): Promise<number[]> {
  const keys = ranges.map((d) => `${d.from} WHERE ${d.where.join(' AND ')} ${JSON.stringify(d.params)}`);
  const known = keys.map((key) => rangeEstimates.get(key));
  const missing = ranges.flatMap((d, i) => (known[i] === undefined ? [{ d, i }] : []));
  if (missing.length) {
    const plan = await plainSelect<{ id: number | null; rows: number | null }>(
      sequelize,
      `EXPLAIN ${missing.map(({ d }) => `SELECT 1 FROM ${d.from} WHERE ${d.where.join(' AND ')}`).join(' UNION ALL ')}`,
      missing.flatMap(({ d }) => d.params),
    );
    // The plan's rows are numbered by SELECT, 1 for the first; no figure (an impossible condition) means no rows.
    missing.forEach(({ i }, at) => {
      known[i] = Number(plan.find((r) => Number(r.id) === at + 1)?.rows ?? 0);
      rangeEstimates.set(keys[i], known[i]);
    });
  }
  return known.map((n) => n ?? 0);
}

/**
 * The share of the driver's candidates expected to match everything: the estimated matches over the driver's size.
 * Every range holds the state filter when the word indexes do (then all is counted within that state); a state
 * filter no range holds (one word, no project, an order the state index does not serve) counts as its own share.
 */
function matchShare(
  sizes: number[],
  at: number,
  all: { calcs: number; inState: number; drivers: Driver[]; filter: SearchFilter },
): number {
  const withinState = all.drivers[0].term?.hasState ?? false;
  const universe = withinState ? all.inState : all.calcs;
  if (universe <= 0 || sizes[at] <= 0) return 1;
  const stateHeld = withinState || Boolean(all.filter.projectId);
  let matches = universe * (all.filter.status && !stateHeld ? Math.min(1, all.inState / universe) : 1);
  for (const n of sizes) matches *= Math.min(1, n / universe);
  return Math.min(1, matches / sizes[at]);
}

/**
 * The rest of the search on the candidate whose calc id is `id`: each word its term's row joined by primary key, then
 * the filters on the calc's row, as LEFT JOINs for the candidate's table (`joins`, with `params`); `ok` says whether
 * every one was found. Each join is tried only when the one before it found its row, as `EXISTS (…) AND EXISTS (…)`
 * stops at the first that fails. What the driver's own condition already holds is left out: its word (every candidate
 * of a word's index has it), and the state when that index holds it too; with no filter left, the calc row is not
 * read. As dependent `EXISTS` subqueries the same look-ups cost MariaDB 7–17 % more of a chunk's statement, the
 * subquery set up again for every candidate (DEVELOPERS.md, "Measuring speed").
 */
export function matchJoins(
  words: string[],
  filter: SearchFilter,
  id: string,
  term?: Driver['term'],
  inner = false,
): { joins: string; ok: string; params: unknown[]; lookups: number } {
  const others = words.filter((w) => w !== term?.word);
  const own = filterConditions(term?.hasState ? { ...filter, status: undefined } : filter, {
    project: 'wc.project_id',
    state: 'wc.latest_status',
  });
  const lookups = [
    ...others.map((_, i) => ({
      found: `w${i}.calc_id`,
      join: `calc_search_terms w${i}`,
      on: `w${i}.calc_id = ${id} AND w${i}.term = ?`,
    })),
    ...(own.parts.length
      ? [{ found: 'wc.id', join: 'calcs wc', on: `wc.id = ${id} AND ${own.parts.join(' AND ')}` }]
      : []),
  ];
  // Inner joins keep only the candidates that match (a streamed page, calc-search.ts), each tried in turn as well;
  // written STRAIGHT_JOIN, or MariaDB may read a filter's calcs first and sort them (a state filter, by title).
  const joins = lookups.map((l, i) =>
    inner
      ? `STRAIGHT_JOIN ${l.join} ON ${l.on}`
      : `LEFT JOIN ${l.join} ON ${i ? `${lookups[i - 1].found} IS NOT NULL AND ` : ''}${l.on}`,
  );
  return {
    joins: joins.join(' '),
    // The last look-up is tried only when every one before it found its row.
    ok: lookups.length && !inner ? `${lookups[lookups.length - 1].found} IS NOT NULL` : 'TRUE',
    params: [...others, ...own.params],
    lookups: lookups.length,
  };
}

import { plainSelect } from '../db/plain-query';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { CalcListPage } from '../../shared/schemas/calc-dto';
import type { CalcListQuery } from '../../shared/schemas/revision.schema';
import { searchWords } from '../../shared/search/search-words';
import { Calc } from '../db/models';
import { decodeCursor, encodeCursor, keysetCondition, orderBy } from '../http/keyset';
import { blindRevisionIds } from '../independent/blind-lists';
import { CALC_ROW_COLUMNS, CALC_ROW_FROM, keyOf, sortColumns, toItem, type CalcRow } from './calc-list-rows';
import { searchCalcs, type SearchPage } from './calc-search';
import { filterConditions } from './calc-search-plan';
import { forbiddenCheck } from '../authz/forbidden-check';

const listedOf = (r: CalcRow) => ({
  revisionId: r.latest_revision_id,
  ruleSetId: r.latest_rule_set_id,
  authorId: r.latest_author_id,
  status: r.latest_status,
});

/**
 * How many calcs a plain list holds, from the counts kept per project and state (migration 20261231-12): exact at any
 * size, a sum over at most one row per project and state.
 */
function listedCount(query: CalcListQuery): { sql: string; params: unknown[] } {
  const { parts, params } = filterConditions(query, { project: 'calc_counts.project_id', state: 'calc_counts.state' });
  return { sql: `SELECT COALESCE(SUM(n), 0) FROM calc_counts WHERE ${['TRUE', ...parts].join(' AND ')}`, params };
}

/**
 * A page of the plain list (no search words): the filtered calcs in the order's own index. A first page carries the
 * list's total on its rows, so the whole answer is one statement; an empty first page means an empty list.
 */
async function plainPage(query: CalcListQuery, after: (string | number)[] | null): Promise<SearchPage> {
  // Every committed calc has a revision (both are written in one transaction), so no "has one" filter is needed.
  const { parts, params } = filterConditions(query);
  const columns = sortColumns(query.sort, 'c', 'id');
  const where = ['TRUE', ...parts];
  const whereParams = [...params];
  if (after) {
    const k = keysetCondition(columns, after, query.dir);
    where.push(k.sql);
    whereParams.push(...k.replacements);
  }
  const count = after ? null : listedCount(query);
  const rows = await plainSelect<CalcRow & { listed_total?: number }>(
    Calc.sequelize!,
    `SELECT ${CALC_ROW_COLUMNS}${count ? `, (${count.sql}) AS listed_total` : ''} ${CALC_ROW_FROM}
    WHERE ${where.join(' AND ')} ORDER BY ${orderBy(columns, query.dir)} LIMIT ${query.size + 1}`,
    [...(count?.params ?? []), ...whereParams],
  );
  const more = rows.length > query.size;
  const shown = rows.slice(0, query.size);
  const counted = count ? { total: Number(rows[0]?.listed_total ?? 0), totalIsAtLeast: false } : null;
  return { rows: shown, next: more ? keyOf(shown[shown.length - 1], query.sort) : null, stoppedEarly: false, counted };
}

/**
 * Calcs by their latest revision, filtered, searched, sorted and paged by keyset from the summary
 * columns. Search words go through the term index (server/calcs/calc-search.ts).
 */
export async function listCalcs(ability: AppAbility, query: CalcListQuery): Promise<CalcListPage> {
  forbiddenCheck(ability).throwUnlessCan('read', 'Calc');
  const after = query.after ? decodeCursor(query.after, sortColumns(query.sort, 'c', 'id')) : null;
  const words = query.q ? searchWords(query.q) : [];
  const found = words.length
    ? await searchCalcs(Calc.sequelize!, {
        words,
        filter: { projectId: query.projectId, status: query.status },
        sort: query.sort,
        dir: query.dir,
        size: query.size,
        after,
      })
    : await plainPage(query, after);
  const blind = await blindRevisionIds(ability, found.rows.map(listedOf));
  return {
    items: found.rows.map((r) => toItem(blind.has(r.latest_revision_id) ? { ...r, latest_verdict: null } : r)),
    size: query.size,
    total: found.counted?.total ?? null,
    totalIsAtLeast: found.counted?.totalIsAtLeast ?? false,
    next: found.next ? encodeCursor(found.next) : null,
    stoppedEarly: found.stoppedEarly,
  };
}

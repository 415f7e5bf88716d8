import { ForbiddenError } from '@casl/ability';
import { QueryTypes } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { KeysetPage } from '../../shared/schemas/common.schema';
import type { CalcListItem } from '../../shared/schemas/calc-dto';
import { REVISION_STATES, type CalcListQuery, type RevisionState } from '../../shared/schemas/revision.schema';
import { Calc } from '../db/models';
import { cappedCount, decodeCursor, encodeCursor, keysetCondition, orderBy, type KeyColumn } from '../http/keyset';
import { blindRevisionIds } from '../independent/blind-lists';

const ID: KeyColumn = { sql: 'c.id' };
const UPDATED: KeyColumn = { sql: 'c.latest_updated_at', isDate: true };

// Each order has an index (migrations/20261220-0301-calc-summaries.ts), with and without a project in front.
const SORTS: Record<CalcListQuery['sort'], KeyColumn[]> = {
  number: [{ sql: 'c.number' }, ID],
  title: [{ sql: 'c.title' }, ID],
  updatedAt: [UPDATED, ID],
  status: [{ sql: 'c.latest_status', domain: REVISION_STATES }, UPDATED, ID],
};

interface Row {
  id: number;
  project_id: number;
  project_code: string;
  number: string;
  title: string;
  part_ref: string;
  latest_revision_id: number;
  latest_label: string;
  latest_status: RevisionState;
  latest_verdict: string | null;
  latest_author_id: number;
  author_name: string;
  latest_rule_set_id: number;
  rs_code: string | null;
  rs_version: number | null;
  latest_updated_at: Date;
  project_archived: number;
}

const SELECT = `SELECT c.id, c.project_id, c.project_code, c.number, c.title, c.part_ref, c.latest_revision_id, c.latest_label,
  c.latest_status, c.latest_verdict, c.latest_author_id, c.author_name, c.latest_rule_set_id, c.latest_updated_at,
  rs.code AS rs_code, rs.version AS rs_version, p.status = 'archived' AS project_archived`;

/**
 * The search box: every word of three or more letters must start a word of the calc's number,
 * title, drawing/part, project code, author or state (InnoDB full-text, boolean mode). Words that
 * are shorter than the index keeps fall back to a number prefix, which the number index serves.
 */
export function searchCondition(q: string): { sql: string; replacements: unknown[] } {
  const words = q.split(/[^\p{L}\p{N}]+/u).filter((w) => w.length >= 3);
  if (words.length > 0)
    return {
      sql: 'MATCH(c.search_text) AGAINST (? IN BOOLEAN MODE)',
      replacements: [words.map((w) => `+${w}*`).join(' ')],
    };
  return { sql: 'c.number LIKE ?', replacements: [`${q.replace(/[\\%_]/g, '\\$&')}%`] };
}

const listedOf = (r: Row) => ({
  revisionId: r.latest_revision_id,
  ruleSetId: r.latest_rule_set_id,
  authorId: r.latest_author_id,
  status: r.latest_status,
});

function toItem(r: Row): CalcListItem {
  return {
    id: r.id,
    projectId: r.project_id,
    projectCode: r.project_code,
    number: r.number,
    title: r.title,
    partRef: r.part_ref,
    projectArchived: Boolean(r.project_archived),
    latest: {
      id: r.latest_revision_id,
      label: r.latest_label,
      status: r.latest_status,
      verdict: r.latest_verdict,
      author: { id: r.latest_author_id, name: r.author_name },
      ruleSet: { id: r.latest_rule_set_id, code: r.rs_code ?? '', version: r.rs_version ?? 0 },
      updatedAt: new Date(r.latest_updated_at).toISOString(),
    },
  };
}

const keyOf = (r: Row, sort: CalcListQuery['sort']): (string | number)[] =>
  ({
    number: [r.number, r.id],
    title: [r.title, r.id],
    updatedAt: [new Date(r.latest_updated_at).toISOString(), r.id],
    status: [r.latest_status, new Date(r.latest_updated_at).toISOString(), r.id],
  })[sort];

/** Calcs by their latest revision, filtered, searched, sorted and paged by keyset from the summary columns. */
export async function listCalcs(ability: AppAbility, query: CalcListQuery): Promise<KeysetPage<CalcListItem>> {
  ForbiddenError.from(ability).throwUnlessCan('read', 'Calc');
  // Every committed calc has a revision (both are written in one transaction), so no "has one" filter is needed.
  const where = ['TRUE'];
  const params: unknown[] = [];
  if (query.projectId) {
    where.push('c.project_id = ?');
    params.push(query.projectId);
  }
  if (query.status) {
    where.push('c.latest_status = ?');
    params.push(query.status);
  }
  if (query.q) {
    const s = searchCondition(query.q);
    where.push(s.sql);
    params.push(...s.replacements);
  }
  const filter = `FROM calcs c WHERE ${where.join(' AND ')}`;
  const columns = SORTS[query.sort];
  const page = [...where];
  const pageParams = [...params];
  if (query.after) {
    const k = keysetCondition(columns, decodeCursor(query.after, columns), query.dir);
    page.push(k.sql);
    pageParams.push(...k.replacements);
  }
  const sequelize = Calc.sequelize!;
  const [rows, counted] = await Promise.all([
    sequelize.query<Row>(
      `${SELECT} FROM calcs c LEFT JOIN rule_sets rs ON rs.id = c.latest_rule_set_id
      JOIN projects p ON p.id = c.project_id WHERE ${page.join(' AND ')}
      ORDER BY ${orderBy(columns, query.dir)} LIMIT ${query.size + 1}`,
      { replacements: pageParams, type: QueryTypes.SELECT },
    ),
    query.after ? null : cappedCount(sequelize, filter, params),
  ]);
  const more = rows.length > query.size;
  const items = rows.slice(0, query.size);
  const blind = await blindRevisionIds(ability, items.map(listedOf));
  return {
    items: items.map((r) => toItem(blind.has(r.latest_revision_id) ? { ...r, latest_verdict: null } : r)),
    size: query.size,
    total: counted?.total ?? null,
    totalIsAtLeast: counted?.totalIsAtLeast ?? false,
    next: more ? encodeCursor(keyOf(items[items.length - 1], query.sort)) : null,
  };
}

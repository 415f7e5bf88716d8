// What a calc list row is read as, and the list orders: shared by the plain list and the search box.
import type { CalcListItem } from '../../shared/schemas/calc-dto';
import { REVISION_STATES, type CalcListQuery, type RevisionState } from '../../shared/schemas/revision.schema';
import type { KeyColumn } from '../http/keyset';

export type CalcSort = CalcListQuery['sort'];

/** The key columns of each order over a table alias; the id column breaks ties. */
export function sortColumns(sort: CalcSort, alias: string, id: string): KeyColumn[] {
  const updated: KeyColumn = { sql: `${alias}.latest_updated_at`, isDate: true };
  const last: KeyColumn = { sql: `${alias}.${id}` };
  return {
    number: [{ sql: `${alias}.number` }, last],
    title: [{ sql: `${alias}.title` }, last],
    updatedAt: [updated, last],
    status: [{ sql: `${alias}.latest_status`, domain: REVISION_STATES }, updated, last],
  }[sort];
}

export interface CalcRow {
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

// Every calc has its project (a foreign key), so LEFT JOIN gives the same rows; it keeps calcs the table read first.
// With an inner join MariaDB read the few projects first, then every calc of each, and sorted the whole library
// before keeping a page of it (10,000 calcs: p95 1,457 ms at 32 concurrent; test/server/list-plans.spec.ts).
export const CALC_ROW_COLUMNS = `c.id, c.project_id, c.project_code, c.number, c.title, c.part_ref, c.latest_revision_id,
  c.latest_label, c.latest_status, c.latest_verdict, c.latest_author_id, c.author_name, c.latest_rule_set_id,
  c.latest_updated_at, rs.code AS rs_code, rs.version AS rs_version, p.status = 'archived' AS project_archived`;
export const CALC_ROW_JOINS =
  'LEFT JOIN rule_sets rs ON rs.id = c.latest_rule_set_id LEFT JOIN projects p ON p.id = c.project_id';
export const CALC_ROW_FROM = `FROM calcs c ${CALC_ROW_JOINS}`;
export const CALC_ROW_SQL = `SELECT ${CALC_ROW_COLUMNS} ${CALC_ROW_FROM}`;

/** The sort values of a row as a cursor holds them (dates as ISO text). */
export function keyOf(r: CalcRow, sort: CalcSort): (string | number)[] {
  const at = () => new Date(r.latest_updated_at).toISOString();
  if (sort === 'number') return [r.number, r.id];
  if (sort === 'title') return [r.title, r.id];
  return sort === 'updatedAt' ? [at(), r.id] : [r.latest_status, at(), r.id];
}

export function toItem(r: CalcRow): CalcListItem {
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

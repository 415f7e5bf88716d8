import type { AuditRecordRef } from '../../shared/schemas/audit.schema';

/** The entity id of audit table `t` as a record's id when it is one: 1 to 15 digits and nothing else. */
const recordId = (t: string) =>
  `IF(CHAR_LENGTH(${t}.entity_id) BETWEEN 1 AND 15 AND ${t}.entity_id NOT REGEXP '[^0-9]', ` +
  `CAST(${t}.entity_id AS UNSIGNED), NULL)`;

/**
 * What each audit row is about, in the words and numbers people use: "KFD-210 calc CV-7 rev B" with a link, not
 * "Revision 7". Read with the page itself: each row of audit table `t` joined by primary key to the record its type
 * names, a revision with its calc's number. Read as a statement of its own (one part per record type), the look-up
 * cost the app a further round trip on every page (DEVELOPERS.md, "Measuring speed").
 */
export function recordLookup(t: string): { columns: string; joins: string } {
  const id = recordId(t);
  return {
    columns: `${id} AS recordId, COALESCE(rc.id, cc.id, pp.id, rs.id, uu.id) IS NOT NULL AS recordFound,
      COALESCE(rc.number, cc.number, pp.code, rs.code, uu.display_name) AS recordA,
      COALESCE(rv.label, rs.version) AS recordB, rv.calc_id AS recordC`,
    joins: `LEFT JOIN revisions rv ON ${t}.entity_type = 'Revision' AND rv.id = ${id}
      LEFT JOIN calcs rc ON rc.id = rv.calc_id
      LEFT JOIN calcs cc ON ${t}.entity_type = 'Calc' AND cc.id = ${id}
      LEFT JOIN projects pp ON ${t}.entity_type = 'Project' AND pp.id = ${id}
      LEFT JOIN rule_sets rs ON ${t}.entity_type = 'RuleSet' AND rs.id = ${id}
      LEFT JOIN users uu ON ${t}.entity_type = 'User' AND uu.id = ${id}`,
  };
}

export interface RecordColumns {
  entityType: string;
  entityId: string | null;
  recordId: number | string | null;
  recordFound: number | null;
  recordA: string | null;
  recordB: string | number | null;
  recordC: number | null;
}

interface Found {
  type: string;
  id: number;
  a: string;
  b: string | number | null;
  c: number | null;
}

function refOf(r: Found): AuditRecordRef {
  switch (r.type) {
    case 'Revision':
      return { label: `calc ${r.a} rev ${r.b}`, link: `/calcs/${r.c}?rev=${r.id}` };
    case 'Calc':
      return { label: `calc ${r.a}`, link: `/calcs/${r.id}` };
    case 'Project':
      return { label: `project ${r.a}`, link: `/projects/${r.id}` };
    case 'RuleSet':
      return { label: `standard ${r.a} v${r.b}`, link: `/rule-sets/${r.id}` };
    default:
      return { label: `account of ${r.a}`, link: null };
  }
}

/** The record types `recordLookup` joins: a row of another type names no stored record. */
const RECORD_TYPES = new Set(['Revision', 'Calc', 'Project', 'RuleSet', 'User']);

/** What is named by a key rather than a stored record, in the words of the screen that shows it. */
const NAMED: Record<string, AuditRecordRef> = {
  'Settings:review-health': { label: 'review-health thresholds', link: '/review-health' },
};

/** A row's record in words. */
export function recordOf(row: RecordColumns): AuditRecordRef {
  if (!row.entityId) return { label: row.entityType, link: null };
  if (!RECORD_TYPES.has(row.entityType))
    return NAMED[`${row.entityType}:${row.entityId}`] ?? { label: `${row.entityType} ${row.entityId}`, link: null };
  if (!Number(row.recordFound)) return { label: `${row.entityType} ${row.entityId} (no longer stored)`, link: null };
  return refOf({ type: row.entityType, id: Number(row.recordId), a: row.recordA!, b: row.recordB, c: row.recordC });
}

import { QueryTypes, type Sequelize } from 'sequelize';
import type { AuditRecordRef } from '../../shared/schemas/audit.schema';

type Row = { entityType: string; entityId: string | null };

/** One part of the look-up per record type (each names its columns: any may come first): id and up to three values. */
const LOOKUPS: Record<string, string> = {
  Revision: `SELECT 'Revision' AS type, r.id, c.number AS a, r.label AS b, r.calc_id AS c
    FROM revisions r JOIN calcs c ON c.id = r.calc_id WHERE r.id IN (?)`,
  Calc: "SELECT 'Calc' AS type, id, number AS a, NULL AS b, NULL AS c FROM calcs WHERE id IN (?)",
  Project: "SELECT 'Project' AS type, id, code AS a, NULL AS b, NULL AS c FROM projects WHERE id IN (?)",
  RuleSet: "SELECT 'RuleSet' AS type, id, code AS a, version AS b, NULL AS c FROM rule_sets WHERE id IN (?)",
  User: "SELECT 'User' AS type, id, display_name AS a, NULL AS b, NULL AS c FROM users WHERE id IN (?)",
};

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

/**
 * What each audit row is about, in the words and numbers people use: "KFD-210 calc CV-7 rev B"
 * with a link, not "Revision 7". One statement for the whole page (a part per record type it names, a revision
 * with its calc's number), as plain rows: a statement per type cost more of the app's time than the page itself.
 */
export async function describeRecords(sequelize: Sequelize, rows: Row[]): Promise<Map<string, AuditRecordRef>> {
  const ids = new Map<string, Set<number>>();
  for (const r of rows) {
    if (!r.entityId || !/^\d{1,15}$/.test(r.entityId) || !LOOKUPS[r.entityType]) continue;
    const set = ids.get(r.entityType) ?? new Set<number>();
    ids.set(r.entityType, set.add(Number(r.entityId)));
  }
  const out = new Map<string, AuditRecordRef>();
  if (!ids.size) return out;
  const types = [...ids.keys()];
  const found = await sequelize.query<Found>(types.map((t) => `(${LOOKUPS[t]})`).join(' UNION ALL '), {
    replacements: types.map((t) => [...ids.get(t)!]),
    type: QueryTypes.SELECT,
  });
  for (const r of found) out.set(`${r.type}:${r.id}`, refOf(r));
  return out;
}

export function recordOf(refs: Map<string, AuditRecordRef>, row: Row): AuditRecordRef {
  if (!row.entityId) return { label: row.entityType, link: null };
  return (
    refs.get(`${row.entityType}:${row.entityId}`) ?? {
      label: `${row.entityType} ${row.entityId} (no longer stored)`,
      link: null,
    }
  );
}

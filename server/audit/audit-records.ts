import { Op, QueryTypes } from 'sequelize';
import type { AuditRecordRef } from '../../shared/schemas/audit.schema';
import { Calc, Project, Revision, RuleSetRecord, User } from '../db/models';

type Row = { entityType: string; entityId: string | null };

const idsOf = (rows: Row[], type: string) => [
  ...new Set(rows.filter((r) => r.entityType === type && r.entityId).map((r) => Number(r.entityId))),
];

type Model = typeof Calc | typeof Project | typeof RuleSetRecord | typeof User;

/** Plain rows of the given ids, or none without asking MariaDB when a page names no record of that type. */
async function plainRows<T>(model: Model, ids: number[], attributes: string[]): Promise<T[]> {
  if (!ids.length) return [];
  return (await (model as typeof Calc).findAll({ where: { id: { [Op.in]: ids } }, attributes, raw: true })) as T[];
}

/**
 * What each audit row is about, in the words and numbers people use: "KFD-210 calc CV-7 rev B"
 * with a link, not "Revision 7". Loaded in one query per record type on the page (a revision with its calc's
 * number), side by side, as plain rows.
 */
export async function describeRecords(rows: Row[]): Promise<Map<string, AuditRecordRef>> {
  const revisionIds = idsOf(rows, 'Revision');
  const [revisions, calcs, projects, ruleSets, users] = await Promise.all([
    revisionIds.length
      ? Revision.sequelize!.query<{ id: number; calcId: number; label: string; number: string }>(
          `SELECT r.id, r.calc_id AS calcId, r.label, c.number
             FROM revisions r JOIN calcs c ON c.id = r.calc_id WHERE r.id IN (?)`,
          { replacements: [revisionIds], type: QueryTypes.SELECT },
        )
      : [],
    plainRows<{ id: number; number: string }>(Calc, idsOf(rows, 'Calc'), ['id', 'number']),
    plainRows<{ id: number; code: string }>(Project, idsOf(rows, 'Project'), ['id', 'code']),
    plainRows<{ id: number; code: string; version: number }>(RuleSetRecord, idsOf(rows, 'RuleSet'), [
      'id',
      'code',
      'version',
    ]),
    plainRows<{ id: number; displayName: string }>(User, idsOf(rows, 'User'), ['id', 'displayName']),
  ]);
  const out = new Map<string, AuditRecordRef>();
  for (const r of revisions)
    out.set(`Revision:${r.id}`, { label: `calc ${r.number} rev ${r.label}`, link: `/calcs/${r.calcId}?rev=${r.id}` });
  for (const c of calcs) out.set(`Calc:${c.id}`, { label: `calc ${c.number}`, link: `/calcs/${c.id}` });
  for (const p of projects) out.set(`Project:${p.id}`, { label: `project ${p.code}`, link: `/projects/${p.id}` });
  for (const s of ruleSets)
    out.set(`RuleSet:${s.id}`, { label: `standard ${s.code} v${s.version}`, link: `/rule-sets/${s.id}` });
  for (const u of users) out.set(`User:${u.id}`, { label: `account of ${u.displayName}`, link: null });
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

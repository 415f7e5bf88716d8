import { Op } from 'sequelize';
import type { AuditRecordRef } from '../../shared/schemas/audit.schema';
import { Calc, Project, Revision, RuleSetRecord, User } from '../db/models';

type Row = { entityType: string; entityId: string | null };

const idsOf = (rows: Row[], type: string) => [
  ...new Set(rows.filter((r) => r.entityType === type && r.entityId).map((r) => Number(r.entityId))),
];

/**
 * What each audit row is about, in the words and numbers people use: "KFD-210 calc CV-7 rev B"
 * with a link, not "Revision 7". Loaded in one query per record type for the whole page of rows.
 */
export async function describeRecords(rows: Row[]): Promise<Map<string, AuditRecordRef>> {
  const [revisions, calcsById, projects, ruleSets, users] = await Promise.all([
    Revision.findAll({ where: { id: { [Op.in]: idsOf(rows, 'Revision') } }, attributes: ['id', 'calcId', 'label'] }),
    Calc.findAll({ where: { id: { [Op.in]: idsOf(rows, 'Calc') } }, attributes: ['id', 'number'] }),
    Project.findAll({ where: { id: { [Op.in]: idsOf(rows, 'Project') } }, attributes: ['id', 'code'] }),
    RuleSetRecord.findAll({
      where: { id: { [Op.in]: idsOf(rows, 'RuleSet') } },
      attributes: ['id', 'code', 'version'],
    }),
    User.findAll({ where: { id: { [Op.in]: idsOf(rows, 'User') } }, attributes: ['id', 'displayName'] }),
  ]);
  const calcsOfRevisions = await Calc.findAll({
    where: { id: { [Op.in]: [...new Set(revisions.map((r) => r.calcId))] } },
    attributes: ['id', 'number'],
  });
  const calcNumber = new Map([...calcsById, ...calcsOfRevisions].map((c) => [c.id, c.number]));
  const out = new Map<string, AuditRecordRef>();
  for (const r of revisions)
    out.set(`Revision:${r.id}`, {
      label: `calc ${calcNumber.get(r.calcId) ?? r.calcId} rev ${r.label}`,
      link: `/calcs/${r.calcId}?rev=${r.id}`,
    });
  for (const c of calcsById) out.set(`Calc:${c.id}`, { label: `calc ${c.number}`, link: `/calcs/${c.id}` });
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

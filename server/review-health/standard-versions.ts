import { Op } from 'sequelize';
import { RuleSetRecord } from '../db/models';

export interface VersionFacts {
  id: number;
  code: string;
  version: number;
  /** The next version of the same standard that took effect, and its effective date (YYYY-MM-DD). */
  replacedBy: { id: number; version: number; on: string } | null;
  /** The version of the same standard in force today, when it is another one. */
  currentId: number | null;
}

/**
 * For every version that has been in force: which version replaced it and when, and which is in force
 * now. A handful of rows per standard, so read whole (the `document` text stays behind).
 */
export async function versionFacts(): Promise<Map<number, VersionFacts>> {
  const rows = await RuleSetRecord.findAll({
    attributes: ['id', 'code', 'version', 'status', 'effectiveDate'],
    where: { status: { [Op.in]: ['effective', 'retired'] } },
    order: [
      ['code', 'ASC'],
      ['version', 'ASC'],
    ],
  });
  const out = new Map<number, VersionFacts>();
  for (const r of rows) {
    const later = rows.filter((o) => o.code === r.code && o.version > r.version && o.effectiveDate);
    const next = later[0];
    const current = rows.find((o) => o.code === r.code && o.status === 'effective');
    out.set(r.id, {
      id: r.id,
      code: r.code,
      version: r.version,
      replacedBy: next ? { id: next.id, version: next.version, on: next.effectiveDate! } : null,
      currentId: current && current.id !== r.id ? current.id : null,
    });
  }
  return out;
}

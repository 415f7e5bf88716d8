import { Op } from 'sequelize';
import type { PackCheck } from '../../shared/schemas/verify.schema';
import { AuditEvent } from '../db/models';
import type { PackRecord } from '../evidence/pack-verify';
import { verifyRecordHash } from './verify.service';

/** The seal of an untouched pack is in the audit trail, written when the pack was exported. */
export async function sealCheck(sealHash: string): Promise<PackCheck> {
  const row = await AuditEvent.findOne({
    where: { action: 'evidence.exported', payload: { [Op.like]: `%"manifestSha256":"${sealHash}"%` } },
  });
  return row
    ? {
        name: 'seal',
        ok: true,
        detail: `manifest matches the pack exported ${row.occurredAt.toISOString().slice(0, 16).replace('T', ' ')} UTC by ${row.actorName}`,
      }
    : {
        name: 'seal',
        ok: false,
        detail:
          'no pack with this manifest was ever exported by this server: the pack was altered or comes from elsewhere',
      };
}

/** Each record's hash must still belong to a stored revision (now, or when it was signed). */
export async function recordOnRecord(path: string, record: PackRecord | null): Promise<PackCheck> {
  if (!record?.contentHash)
    return { name: `${path} on record`, ok: true, detail: 'no content hash (input errors); nothing to look up' };
  const found = await verifyRecordHash(record.contentHash);
  const m = found.matches[0];
  return { name: `${path} on record`, ok: found.found && m.contentIntact, detail: found.message };
}

export async function auditOnRecord(hashes: string[]): Promise<PackCheck> {
  if (hashes.length === 0) return { name: 'audit rows on record', ok: true, detail: 'no audit rows in the pack' };
  const found = await AuditEvent.count({ where: { hash: { [Op.in]: hashes } } });
  const ok = found === new Set(hashes).size;
  return {
    name: 'audit rows on record',
    ok,
    detail: ok
      ? `all ${found} rows are in this server's audit chain`
      : `${new Set(hashes).size - found} rows are not in this server's audit chain`,
  };
}

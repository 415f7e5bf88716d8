import { z } from 'zod';
import { decimalId, pageQuerySchema } from './common.schema';

// An id in the address: a whole number from 1 (a negative one is a number too, so the message says which).
const id = decimalId('a whole number from 1').optional();
const day = z.iso.date({ error: 'must be a date (YYYY-MM-DD)' }).optional();

export const auditQuerySchema = pageQuerySchema
  .extend({
    entityType: z.string().trim().max(32).optional(),
    action: z.string().trim().max(64).optional(),
    projectId: id,
    calcId: id,
    userId: id,
    from: day,
    to: day,
    /** Keyset paging: entries older than this id (the last id of the previous page). */
    after: id,
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: 'must not be after "to"', path: ['from'] });
export type AuditQuery = z.infer<typeof auditQuerySchema>;

/** What an audit row is about, as people name it, with a link to open it where there is one. */
export interface AuditRecordRef {
  label: string;
  link: string | null;
}

export interface AuditEventDto {
  id: number;
  occurredAt: string;
  actorId: number | null;
  actorName: string;
  action: string;
  entityType: string;
  entityId: string | null;
  /** Added when listing (audit-records.ts); the stored row itself keeps only type and id. */
  record?: AuditRecordRef;
  payload: unknown;
  /** Lists leave the diff out (it can be large): `hasDiff` says one exists; GET /api/audit/:id has it. */
  diff: string | null;
  hasDiff: boolean;
  prevHash: string;
  hash: string;
}

export interface AuditChainStatus {
  ok: boolean;
  checked: number;
  brokenAt?: number;
  checkedAt: string;
}

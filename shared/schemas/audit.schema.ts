import { z } from 'zod';
import { decimalId, pageQuerySchema } from './common.schema';

const id = decimalId().optional();
const day = z.iso.date({ error: 'must be a date (YYYY-MM-DD)' }).optional();

export const auditQuerySchema = pageQuerySchema.extend({
  entityType: z.string().trim().max(32).optional(),
  action: z.string().trim().max(64).optional(),
  projectId: id,
  calcId: id,
  userId: id,
  from: day,
  to: day,
}).refine((q) => !q.from || !q.to || q.from <= q.to, { message: 'must not be after "to"', path: ['from'] });
export type AuditQuery = z.infer<typeof auditQuerySchema>;

export interface AuditEventDto {
  id: number;
  occurredAt: string;
  actorId: number | null;
  actorName: string;
  action: string;
  entityType: string;
  entityId: string | null;
  payload: unknown;
  diff: string | null;
  prevHash: string;
  hash: string;
}

export interface AuditChainStatus {
  ok: boolean;
  checked: number;
  brokenAt?: number;
  checkedAt: string;
}

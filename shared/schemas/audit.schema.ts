import { z } from 'zod';
import { pageQuerySchema } from './common.schema';

export const auditQuerySchema = pageQuerySchema.extend({
  entityType: z.string().trim().max(32).optional(),
  action: z.string().trim().max(64).optional(),
});
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

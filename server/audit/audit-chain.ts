import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import { z } from 'zod';

export const GENESIS_HASH = '0'.repeat(64);

/**
 * The fields of an audit row that its hash covers (everything but the id and the hashes), declared
 * once: the chain writes them, and an evidence pack's audit excerpt is checked against them.
 */
export const chainedContentSchema = z.strictObject({
  occurredAt: z.string().max(40),
  actorId: z.number().int().nullable(),
  actorName: z.string(),
  action: z.string(),
  entityType: z.string(),
  entityId: z.string().nullable(),
  payload: z.string(),
  diff: z.string().nullable(),
  ip: z.string().nullable(),
});
export type ChainedContent = z.infer<typeof chainedContentSchema>;

/** SHA-256 over the previous hash and the RFC 8785 canonical JSON of the row's content. */
export function chainHash(prevHash: string, content: ChainedContent): string {
  return createHash('sha256')
    .update(prevHash)
    .update(canonicalize(content) ?? '')
    .digest('hex');
}

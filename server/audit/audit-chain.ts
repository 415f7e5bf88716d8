import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';

export const GENESIS_HASH = '0'.repeat(64);

/** The fields of an audit row that its hash covers (everything but the id and the hashes). */
export interface ChainedContent {
  occurredAt: string;
  actorId: number | null;
  actorName: string;
  action: string;
  entityType: string;
  entityId: string | null;
  payload: string;
  diff: string | null;
  ip: string | null;
}

/** SHA-256 over the previous hash and the RFC 8785 canonical JSON of the row's content. */
export function chainHash(prevHash: string, content: ChainedContent): string {
  return createHash('sha256').update(prevHash).update(canonicalize(content) ?? '').digest('hex');
}

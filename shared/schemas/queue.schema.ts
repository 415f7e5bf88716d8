import type { KeysetPage } from './common.schema';
import type { RevisionState } from './revision.schema';

export const QUEUE_KEYS = ['my-drafts', 'returned-to-me', 'awaiting-my-check', 'awaiting-my-approval'] as const;
export type QueueKey = (typeof QUEUE_KEYS)[number];

export const QUEUE_LABELS: Record<QueueKey, string> = {
  'my-drafts': 'My drafts',
  'returned-to-me': 'Returned to me',
  'awaiting-my-check': 'Waiting for my check',
  'awaiting-my-approval': 'Waiting for my approval',
};

export interface QueueItem {
  calcId: number; revisionId: number; projectCode: string; number: string; title: string;
  revision: string; status: RevisionState; verdict: string | null; authorName: string;
  /** When the revision entered its current state (last save for drafts). */
  since: string;
}

/** One page of a queue, oldest first; the first page carries the (capped) count. */
export interface QueueDto extends KeysetPage<QueueItem> { key: QueueKey; label: string }

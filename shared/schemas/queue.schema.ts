import type { KeysetPage } from './common.schema';
import type { RevisionState } from './revision.schema';
import { QUEUES } from '../workflow/revision-states';

// Which queues exist, their order, labels and states come from the workflow table.
export const QUEUE_KEYS = QUEUES.map((q) => q.key) as unknown as readonly [QueueKey, ...QueueKey[]];
export type QueueKey = (typeof QUEUES)[number]['key'];

export const QUEUE_LABELS = Object.fromEntries(QUEUES.map((q) => [q.key, q.label])) as Record<QueueKey, string>;

export interface QueueItem {
  calcId: number;
  revisionId: number;
  projectCode: string;
  number: string;
  title: string;
  revision: string;
  status: RevisionState;
  verdict: string | null;
  authorName: string;
  /** When the revision entered its current state (last save for drafts). */
  since: string;
}

/** One page of a queue, oldest first; the first page carries the (capped) count. */
export interface QueueDto extends KeysetPage<QueueItem> {
  key: QueueKey;
  label: string;
}

import { z } from 'zod';
import { jsonDocumentSchema } from './common.schema';

export const RULE_SET_STATUSES = ['draft', 'effective', 'retired'] as const;

export const createDraftSchema = z
  .object({
    fromId: z.number({ error: 'must be the id of the version to start from' }).int().positive(),
  })
  .strict();

export const updateDraftSchema = z
  .object({
    // Shipped standards are about 20 kB and 7 levels deep; the caps leave room for much larger ones.
    document: jsonDocumentSchema(512, 24),
    lockVersion: z.number({ error: 'is required' }).int().min(0),
  })
  .strict();

export const proposeSchema = z
  .object({
    effectiveDate: z.iso.date({ error: 'must be a date (YYYY-MM-DD)' }),
    lockVersion: z.number({ error: 'is required' }).int().min(0),
  })
  .strict();

export const confirmSchema = z
  .object({
    password: z.string({ error: 'is required' }).min(1, 'is required'),
    lockVersion: z.number({ error: 'is required' }).int().min(0),
  })
  .strict();

export const tryItSchema = z
  .object({
    revisionId: z.number({ error: 'must be a revision id' }).int().positive(),
  })
  .strict();

export interface RuleSetSummary {
  id: number;
  code: string;
  version: number;
  title: string;
  status: (typeof RULE_SET_STATUSES)[number];
  effectiveDate: string | null;
  contentHash: string;
  lockVersion: number;
  proposedBy: string | null;
  confirmedBy: string | null;
  updatedAt: string;
}

export interface RuleSetDto extends RuleSetSummary {
  document: Record<string, unknown>;
}

export interface ImpactRow {
  calcId: number;
  revisionId: number;
  projectCode: string;
  number: string;
  title: string;
  revision: string;
  /** When the re-evaluated revision was approved (ISO 8601, UTC). */
  approvedAt: string | null;
  before: string | null;
  after: string | null;
  /** Clauses whose mandatory rows change between pass and fail. */
  clauses: { clauseId: string; title: string; before: string; after: string; location: string }[];
}

export interface ImpactReport {
  ruleSet: { id: number; code: string; version: number };
  evaluated: number;
  changed: number;
  rows: ImpactRow[];
  elapsedMs: number;
}

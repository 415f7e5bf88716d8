import { z } from 'zod';
import type { Comparison } from '../verification/comparison-types';
import type { VerificationNeed } from '../verification/requirement';
import type { InputIssue, PersonRef } from './calc-dto';

/** Saving the checker's model: the whole calc input (same format as the author's) and the version read. */
export const saveModelSchema = z
  .object({
    input: z.record(z.string(), z.unknown(), { error: 'must be a calc input object' }),
    lockVersion: z.number({ error: 'is required' }).int().min(0),
  })
  .strict();

export const lockModelSchema = z
  .object({
    lockVersion: z.number({ error: 'is required' }).int().min(0),
  })
  .strict();

export type SaveModelRequest = z.infer<typeof saveModelSchema>;

/** What a signature covers of the independent model (content format 3). */
export interface SignedModel {
  checker: string;
  lockedAt: string;
  input: unknown;
  /** SHA-256 of the RFC 8785 JSON of the checker's input, result and checklist. */
  modelHash: string;
  /** Hash of the author's input, result and checklist the comparison was made against. */
  authorHash: string;
  agrees: boolean;
  comparison: Comparison;
}

export interface IndependentModelDto {
  id: number;
  revisionId: number;
  checker: PersonRef;
  state: 'open' | 'locked';
  input: Record<string, unknown>;
  result: unknown | null;
  checklist: unknown | null;
  verdict: string | null;
  inputIssues: InputIssue[];
  lockedAt: string | null;
  modelHash: string | null;
  authorHash: string | null;
  comparison: Comparison | null;
  agrees: boolean | null;
  lockVersion: number;
  updatedAt: string;
}

/**
 * The verification a revision needs and where it stands, as part of every revision read.
 * `blind`: the reader is a checker who must build their own model first, so the author's input,
 * results and checklist are left out of this read.
 */
export interface RevisionVerification {
  need: VerificationNeed;
  blind: boolean;
  model: {
    state: 'open' | 'locked';
    checker: PersonRef;
    lockedAt: string | null;
    agrees: boolean | null;
    differences: number | null;
  } | null;
  /** The signed part of a locked model (content format 3); null until locked. */
  signed: SignedModel | null;
}

import { z } from 'zod';
import { cursorSchema, decimalId, jsonDocumentSchema } from './common.schema';
import { MEANINGS, REVISION_STATES } from '../workflow/revision-states';
import { SEARCH_MAX_WORDS, searchWords } from '../search/search-words';

// The states, their labels and which are editable are defined by the workflow table.
export { REVISION_STATES, type RevisionState } from '../workflow/revision-states';
export { EDITABLE_STATES, STATE_LABELS } from '../workflow/state-sets';

const calcNumber = z
  .string({ error: 'is required' })
  .trim()
  .min(2, 'must be at least 2 characters')
  .max(40, 'is at most 40 characters')
  .regex(/^[A-Za-z0-9][A-Za-z0-9./-]*$/, 'may use letters, digits, dot, slash and dash');

/** The author's input is kept even while incomplete, so autosave never loses work; 256 kB is ample. */
export const draftInputSchema = jsonDocumentSchema(256, 12);

export const createCalcSchema = z
  .object({
    projectId: z.number({ error: 'must be a number' }).int().positive(),
    number: calcNumber,
    title: z
      .string({ error: 'is required' })
      .trim()
      .min(3, 'must be at least 3 characters')
      .max(200, 'is at most 200 characters'),
    partRef: z.string().trim().max(120, 'is at most 120 characters').default(''),
    ruleSetId: z.number({ error: 'must be a number' }).int().positive(),
    input: draftInputSchema,
  })
  .strict();
export type CreateCalcRequest = z.infer<typeof createCalcSchema>;

export const saveRevisionSchema = z
  .object({
    input: draftInputSchema,
    ruleSetId: z.number().int().positive().optional(),
    lockVersion: z.number({ error: 'is required (the version you started from)' }).int().min(0),
  })
  .strict();
export type SaveRevisionRequest = z.infer<typeof saveRevisionSchema>;

export const signSchema = z
  .object({
    password: z.string({ error: 'is required' }).min(1, 'is required').max(256),
    meaning: z.enum(MEANINGS, { error: 'must be authored, checked or approved' }),
    idempotencyKey: z
      .string({ error: 'is required' })
      .regex(/^[A-Za-z0-9-]{16,64}$/, 'must be 16–64 letters, digits or dashes'),
    lockVersion: z.number({ error: 'is required' }).int().min(0),
    oneTimeCode: z
      .string()
      .trim()
      .regex(/^\d{6}$/, 'must be the 6 digits your authenticator app shows')
      .optional(),
  })
  .strict();
export type SignRequest = z.infer<typeof signSchema>;

export const returnSchema = z
  .object({
    reason: z.string({ error: 'is required' }).trim().min(5, 'must say why, in at least 5 characters').max(4000),
    lockVersion: z.number({ error: 'is required' }).int().min(0),
  })
  .strict();

export const withdrawSchema = returnSchema;

export const newRevisionSchema = z
  .object({
    reasonForChange: z
      .string({ error: 'is required' })
      .trim()
      .min(5, 'must say why, in at least 5 characters')
      .max(4000),
    /** Copy the previous revision's attachments into the new one; off unless asked, and the trail says which. */
    carryAttachments: z.boolean({ error: 'must be true or false' }).default(false),
  })
  .strict();

export const findingSchema = z
  .object({
    text: z.string({ error: 'is required' }).trim().min(3, 'must be at least 3 characters').max(4000),
    clauseRef: z.string().trim().min(1, 'is required').max(120).optional(),
    /** A checklist row's location with clauseRef, or a named input without it: `segments[1]`, `segments[1].od`. */
    anchorPath: z
      .string()
      .trim()
      .max(200)
      .regex(
        /^[A-Za-z]+(\[\d+\])?(\.[A-Za-z]+(\[\d+\])?)*$/,
        'must name an input as the calc stores it, e.g. segments[1].od',
      )
      .optional(),
  })
  .strict();

export const answerSchema = z
  .object({
    answer: z.string({ error: 'is required' }).trim().min(3, 'must be at least 3 characters').max(4000),
  })
  .strict();

export const manualItemSchema = z
  .object({
    done: z.boolean({ error: 'must be true or false' }),
    note: z.string().trim().max(1000).default(''),
  })
  .strict();

export const calcListQuerySchema = z.object({
  projectId: decimalId('a project id').optional(),
  status: z.enum(REVISION_STATES).optional(),
  /** The search box: every word must start a word of the calc's number, title, drawing, project, author or state. */
  q: z
    .string()
    .trim()
    .max(100, 'must be at most 100 characters')
    .refine((q) => q === '' || q.length > 100 || searchWords(q).length > 0, 'needs a letter or digit to search for')
    .refine(
      (q) => q.length > 100 || searchWords(q).length <= SEARCH_MAX_WORDS,
      `may hold at most ${SEARCH_MAX_WORDS} words`,
    )
    .optional(),
  /** The `next` cursor of the previous page; without it the list starts at the top and is counted. */
  after: cursorSchema,
  size: z.coerce.number().int().min(1).max(200).default(50),
  sort: z.enum(['number', 'title', 'updatedAt', 'status']).default('updatedAt'),
  dir: z.enum(['asc', 'desc']).default('desc'),
});
export type CalcListQuery = z.infer<typeof calcListQuerySchema>;

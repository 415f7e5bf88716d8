import { z } from 'zod';

export const REVISION_SCHEMES = ['letters', 'numbers'] as const;
export const PROJECT_STATUSES = ['active', 'archived'] as const;

const code = z
  .string({ error: 'is required' })
  .trim()
  .min(2, 'must be at least 2 characters')
  .max(32, 'is at most 32 characters')
  .regex(/^[A-Z0-9][A-Z0-9-]*$/, 'may use capital letters, digits and dashes');

export const createProjectSchema = z
  .object({
    code,
    name: z
      .string({ error: 'is required' })
      .trim()
      .min(3, 'must be at least 3 characters')
      .max(160, 'is at most 160 characters'),
    client: z.string().trim().max(160, 'is at most 160 characters').default(''),
    description: z.string().trim().max(2000, 'is at most 2000 characters').default(''),
    revisionScheme: z
      .enum(REVISION_SCHEMES, { error: 'must be letters (A, B, C…) or numbers (0, 1, 2…)' })
      .default('letters'),
  })
  .strict();
export type CreateProjectRequest = z.infer<typeof createProjectSchema>;

export const updateProjectSchema = createProjectSchema
  .omit({ code: true })
  .partial()
  .extend({ status: z.enum(PROJECT_STATUSES).optional(), version: z.number().int().min(0) })
  .strict();
export type UpdateProjectRequest = z.infer<typeof updateProjectSchema>;

export interface ProjectDto {
  id: number;
  code: string;
  name: string;
  client: string;
  description: string;
  revisionScheme: (typeof REVISION_SCHEMES)[number];
  status: (typeof PROJECT_STATUSES)[number];
  createdAt: string;
  version: number;
}

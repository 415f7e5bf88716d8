import { z } from 'zod';

/*
 * The part of a design standard that says how a calc is verified: by review alone (no entry), or
 * by an independent model the checker builds from the source documents (alternate calculation),
 * for every calc under the standard or only above a duty level. Tolerances say how close the two
 * models must be: inputs compared after unit conversion, results relative to the larger value.
 */
const relative = (what: string) =>
  z
    .number()
    .min(0)
    .max(0.5)
    .meta({ description: `${what}, as a fraction (0.02 = 2 %)` });

export const modelScopeSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('all').meta({ description: 'Every calc under this standard' }) }),
  z.strictObject({
    kind: z.literal('torque-at-least'),
    value: z.number().positive().meta({ description: 'Duty level: largest external torque entry, N·m' }),
  }),
]);

export const verificationSchema = z
  .strictObject({
    method: z.literal('independent-model').meta({
      description: 'The checker verifies by an independent model (alternate calculation), not by review alone',
    }),
    scope: modelScopeSchema,
    tolerances: z.strictObject({
      inputs: relative('Largest relative difference for two inputs to count as equal after unit conversion'),
      results: relative("Largest relative difference between the two models' results"),
    }),
    origin: z
      .string()
      .trim()
      .min(1)
      .max(300)
      .meta({ description: 'Where the requirement comes from: a published practice or "house choice"' }),
  })
  .meta({ description: 'How calcs under this standard are verified; absent: by review alone' });

export type Verification = z.infer<typeof verificationSchema>;
export type ModelScope = z.infer<typeof modelScopeSchema>;
export type Tolerances = Verification['tolerances'];

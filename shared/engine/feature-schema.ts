import { z } from 'zod';
import { STRESS, label, positive, source, station } from './schema-fields';

/*
 * Features at stations (schema.ts): each type with its own geometry, all with optional chart factors and their source.
 */
const factorFields = {
  label,
  source,
  Kt: z.number().min(1).optional().meta({ description: 'Author-entered bending stress-concentration factor' }),
  Kts: z.number().min(1).optional().meta({ description: 'Author-entered torsion stress-concentration factor' }),
};

const filletSchema = z.strictObject({
  type: z.literal('shoulder-fillet'),
  at: station,
  ...factorFields,
  r: positive('Fillet radius'),
});

const keyseatSchema = z.strictObject({
  type: z.literal('keyseat'),
  at: station,
  ...factorFields,
  form: z.enum(['end-mill', 'sled-runner']),
  r: positive('Keyseat root radius (default 0.02·d, Shigley Table 7-1)').optional(),
  width: positive('Key width').optional(),
  height: positive('Key height').optional(),
  length: positive('Key length').optional(),
  Sy: z
    .number()
    .positive()
    .optional()
    .meta({ description: `Key material yield strength, ${STRESS}` }),
});

const ringGrooveSchema = z.strictObject({
  type: z.literal('ring-groove'),
  at: station,
  ...factorFields,
  depth: positive('Groove depth'),
  r: positive('Groove root radius'),
  width: positive('Groove width').optional(),
});

const crossHoleSchema = z.strictObject({
  type: z.literal('cross-hole'),
  at: station,
  ...factorFields,
  diameter: positive('Hole diameter'),
});

export const featureSchema = z.discriminatedUnion('type', [
  filletSchema,
  keyseatSchema,
  ringGrooveSchema,
  crossHoleSchema,
]);

export type FeatureInput = z.infer<typeof featureSchema>;

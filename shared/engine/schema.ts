import { z } from 'zod';
import { beamInputFields, densityField } from './beam/beam-schema';
import { featureSchema } from './feature-schema';
import { LEN, STRESS, TRQ, label, positive, source, station } from './schema-fields';

/*
 * Interchange format v2 of a shaft calc (v1 plus bearings, loads, masses and speed: beam/beam-schema.ts). The schema
 * holds no transforms or defaults, so the JSON Schema generated from it (calc-input.schema.json) describes exactly what
 * the engine accepts; defaults are applied in model.ts and cross-field rules live in the semantic checks.
 */
export const materialSchema = z.strictObject({
  name: label,
  kind: z
    .enum(['steel', 'stainless-steel', 'aluminium', 'cast-iron', 'other'])
    .optional()
    .meta({ description: 'Material family; steel-only methods are flagged on other kinds. Default steel' }),
  E: z.number().positive().meta({ description: "Young's modulus, GPa (SI) or Mpsi (US)" }),
  G: z.number().positive().meta({ description: 'Shear modulus, GPa (SI) or Mpsi (US)' }),
  Sy: z
    .number()
    .positive()
    .meta({ description: `Yield strength, ${STRESS}` }),
  Su: z
    .number()
    .positive()
    .meta({ description: `Ultimate tensile strength, ${STRESS}` }),
  nu: z.number().gt(0).lt(0.5).optional().meta({ description: "Poisson's ratio" }),
  density: densityField,
  source,
});

const segmentSchema = z.strictObject({
  label,
  length: positive('Segment length'),
  od: positive('Outer diameter'),
  id: z
    .number()
    .min(0)
    .meta({ description: `Inner diameter, 0 for a solid segment, ${LEN}` }),
  material: materialSchema.optional().meta({ description: 'Overrides the calc material on this segment' }),
});

const alternating = z
  .number()
  .optional()
  .meta({ description: `Alternating torque amplitude of this entry (in phase with the others), ${TRQ}` });

const torqueSchema = z.union([
  z.strictObject({
    label,
    at: station,
    T: z.number().meta({ description: `External torque, ${TRQ}` }),
    Ta: alternating,
  }),
  z.strictObject({
    label,
    at: station,
    Ta: alternating,
    power: z.number().meta({ description: 'Power, kW (SI) or hp (US); positive drives the shaft' }),
    speed: z.number().positive().meta({ description: 'Speed, rpm' }),
  }),
]);

const bendingSchema = z.strictObject({
  label,
  at: station,
  Ma: z.number().meta({ description: `Alternating bending moment, ${TRQ}` }),
  Mm: z
    .number()
    .optional()
    .meta({ description: `Midrange bending moment, ${TRQ}; default 0` }),
});

export const fatigueSchema = z.strictObject({
  surface: z.enum(['ground', 'machined', 'cold-drawn', 'hot-rolled', 'as-forged']),
  surfaceTable: z
    .enum(['9th-10th', '11th'])
    .optional()
    .meta({ description: 'Edition of Shigley Table 6-2 for ka; default 9th-10th' }),
  reliability: z
    .literal([50, 90, 95, 99, 99.9, 99.99])
    .optional()
    .meta({ description: 'Reliability in %, Shigley Table 6-5; default 50 (ke = 1)' }),
  temperature: z.number().optional().meta({ description: 'Operating temperature, °C (SI) or °F (US), for kd' }),
  kd: z.number().positive().optional().meta({ description: 'Temperature factor entered directly' }),
  kc: z.number().positive().optional().meta({ description: 'Load factor; default 1 (stresses combined by von Mises)' }),
  kf: z.number().positive().optional().meta({ description: 'Miscellaneous-effects factor; default 1' }),
  kfOnMidrange: z.boolean().optional().meta({ description: 'Apply Kf, Kfs to midrange stresses; default true' }),
  alternatingTorqueFraction: z
    .number()
    .min(0)
    .optional()
    .meta({ description: 'Ta = fraction × |Tm| everywhere (instead of per-torque Ta)' }),
  SePrime: z
    .number()
    .positive()
    .optional()
    .meta({ description: `Author-entered unmodified endurance limit, ${STRESS}` }),
  SePrimeSource: source,
});

export const methodsSchema = z
  .strictObject({
    filletKts: z
      .enum(['peterson', 'norton'])
      .optional()
      .meta({ description: 'Kts at shoulder fillets: Peterson torsion polynomial (default) or Norton torsion fit' }),
  })
  .meta({ description: 'Published methods chosen for this calc; a design standard may impose them' });

export const calcInputSchema = z
  .strictObject({
    $schema: z.string().optional(),
    methods: methodsSchema.optional(),
    title: label,
    notes: z.string().max(5000).optional(),
    units: z.enum(['SI', 'US']),
    material: materialSchema,
    segments: z.array(segmentSchema).min(1).max(200),
    torques: z.array(torqueSchema).max(200),
    features: z.array(featureSchema).max(200).optional(),
    bending: z.array(bendingSchema).max(200).optional(),
    fatigue: fatigueSchema.optional(),
    ...beamInputFields,
  })
  .meta({ title: 'Torquetrail shaft calc input, format v2 (v1 files are valid v2)' });

export type CalcInput = z.infer<typeof calcInputSchema>;
export type MaterialInput = z.infer<typeof materialSchema>;
export type SegmentInput = z.infer<typeof segmentSchema>;
export type TorqueInput = z.infer<typeof torqueSchema>;
export type { FeatureInput } from './feature-schema';
export type BendingInput = z.infer<typeof bendingSchema>;
export type FatigueInput = z.infer<typeof fatigueSchema>;

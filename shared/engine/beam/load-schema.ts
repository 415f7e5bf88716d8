import { z } from 'zod';
import { FORCE, LEN, TRQ, direction, label, station } from './element-fields';

/* The loads format v2 puts on a shaft: plain forces, gears, belt or chain drives and couplings. */
const ownTorque = z
  .number()
  .optional()
  .meta({ description: `Torque this element transmits, ${TRQ}; default: the torque entry at the same station` });

const forceLoadSchema = z.strictObject({
  label,
  at: station,
  Fy: z
    .number()
    .optional()
    .meta({ description: `Force on the shaft along +y, ${FORCE}` }),
  Fz: z
    .number()
    .optional()
    .meta({ description: `Force on the shaft along +z, ${FORCE}` }),
  Fx: z
    .number()
    .optional()
    .meta({ description: `Axial force on the shaft along +x, ${FORCE}` }),
});

const gearLoadSchema = z.strictObject({
  label,
  at: station,
  kind: z.literal('gear'),
  T: ownTorque,
  pitchDiameter: z
    .number()
    .positive()
    .meta({ description: `Pitch diameter, ${LEN}` }),
  pressureAngle: z.number().gt(0).lt(45).optional().meta({ description: 'Normal pressure angle, deg; default 20' }),
  helixAngle: z
    .number()
    .gt(-60)
    .lt(60)
    .optional()
    .meta({ description: 'Helix angle, deg; 0 for spur (default). Its sign sets the direction of the axial force' }),
  direction: direction.meta({
    description: 'Angle of the mesh point about the axis from +y towards +z, deg; default 0',
  }),
});

const beltLoadSchema = z.strictObject({
  label,
  at: station,
  kind: z.enum(['pulley', 'sprocket']),
  T: ownTorque,
  diameter: z
    .number()
    .positive()
    .meta({ description: `Pitch diameter of the pulley or sprocket, ${LEN}` }),
  pullFactor: z
    .number()
    .min(1)
    .max(5)
    .optional()
    .meta({ description: 'Shaft load / net pull (F1 − F2); default 1.5 for a V-belt pulley, 1.0 for a sprocket' }),
  direction: direction.meta({
    description: 'Direction of the pull on the shaft about the axis from +y towards +z, deg; default 0',
  }),
});

const couplingLoadSchema = z.strictObject({
  label,
  at: station,
  kind: z.literal('coupling'),
  T: ownTorque,
  Fy: z
    .number()
    .optional()
    .meta({ description: `Radial force from misalignment along +y, ${FORCE}; default 0` }),
  Fz: z
    .number()
    .optional()
    .meta({ description: `Radial force from misalignment along +z, ${FORCE}; default 0` }),
});

export const loadSchema = z.union([forceLoadSchema, gearLoadSchema, beltLoadSchema, couplingLoadSchema]);

export type LoadInput = z.infer<typeof loadSchema>;

import { z } from 'zod';

/*
 * Interchange format v2 additions: bearings, loads, attached masses and the operating speed. All
 * optional, so every v1 file is a valid v2 file and evaluates as before. Angles are in degrees,
 * measured about the shaft axis from +y towards +z.
 */
const LEN = 'mm (SI) or in (US)';
const FORCE = 'N (SI) or lbf (US)';
const TRQ = 'N·m (SI) or lbf·in (US)';
const label = z.string().max(200).optional();
const station = z.number().meta({ description: `Station from the left end of the first segment, ${LEN}` });
const direction = z.number().min(-360).max(360).optional();

export const SUPPORT_KINDS = [
  'deep-groove-ball',
  'cylindrical-roller',
  'tapered-roller',
  'spherical-roller',
  'self-aligning-ball',
  'plain',
] as const;

export const supportSchema = z.strictObject({
  label,
  at: station,
  kind: z.enum(SUPPORT_KINDS).meta({ description: 'Bearing kind; sets the life exponent and the slope limit class' }),
  C: z.number().positive().optional().meta({ description: 'Basic dynamic load rating C, kN (SI) or lbf (US)' }),
  locating: z
    .boolean()
    .optional()
    .meta({ description: 'This bearing takes the axial load (locates the shaft axially)' }),
  X: z
    .number()
    .min(0)
    .optional()
    .meta({ description: 'Radial load factor X for P = X·Fr + Y·Fa (from the bearing maker)' }),
  Y: z
    .number()
    .min(0)
    .optional()
    .meta({ description: 'Axial load factor Y for P = X·Fr + Y·Fa (from the bearing maker)' }),
});

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

export const massSchema = z.strictObject({
  label,
  at: station,
  mass: z.number().positive().meta({ description: 'Attached mass (gear, pulley, hub), kg (SI) or lb (US)' }),
});

/** Fields added to the top level of the calc input by format v2. */
export const beamInputFields = {
  supports: z.array(supportSchema).max(50).optional(),
  loads: z.array(loadSchema).max(200).optional(),
  masses: z.array(massSchema).max(200).optional(),
  speed: z
    .number()
    .positive()
    .optional()
    .meta({ description: 'Operating speed, rpm (when no power entry gives one); for bearing life and critical speed' }),
};

export const densityField = z
  .number()
  .positive()
  .optional()
  .meta({ description: 'Density, kg/m³ (SI) or lb/in³ (US); default for steel 7850 kg/m³ or 0.283 lb/in³' });

export type SupportInput = z.infer<typeof supportSchema>;
export type LoadInput = z.infer<typeof loadSchema>;
export type MassInput = z.infer<typeof massSchema>;
export type SupportKind = (typeof SUPPORT_KINDS)[number];

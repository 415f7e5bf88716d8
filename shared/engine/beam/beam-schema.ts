import { z } from 'zod';
import { label, station } from './element-fields';
import { loadSchema } from './load-schema';

/*
 * Interchange format v2 additions: bearings, loads, attached masses and the operating speed. All
 * optional, so every v1 file is a valid v2 file and evaluates as before. Angles are in degrees,
 * measured about the shaft axis from +y towards +z.
 */

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
export type MassInput = z.infer<typeof massSchema>;
export type SupportKind = (typeof SUPPORT_KINDS)[number];

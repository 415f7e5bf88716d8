import { toSI, type UnitSystem } from '../engine';
import { BEAM_BASE, STEEL_DENSITY } from '../engine/beam/beam-units';

/*
 * What each input field means for the comparison: its quantity (so US values are converted to SI
 * before comparing), its name for people and the default the engine applies when it is left out,
 * so "left out" and "entered as the default" compare equal.
 */
export type FieldQuantity =
  | 'length'
  | 'torque'
  | 'stress'
  | 'modulus'
  | 'temperature'
  | 'force'
  | 'rating'
  | 'mass'
  | 'density'
  | 'plain'
  | 'text';

export interface FieldSpec {
  name: string;
  label: string;
  q: FieldQuantity;
  fallback?: number | string | boolean;
}

const SI_UNIT: Record<FieldQuantity, string> = {
  length: 'mm',
  torque: 'N·m',
  stress: 'MPa',
  modulus: 'GPa',
  temperature: '°C',
  force: 'N',
  rating: 'kN',
  mass: 'kg',
  density: 'kg/m³',
  plain: '',
  text: '',
};

export const unitOf = (q: FieldQuantity): string => SI_UNIT[q];

/** A value entered in `units`, in the SI display unit (mm, N·m, MPa, GPa, °C, N, kN, kg, kg/m³). */
export function inSI(value: number, q: FieldQuantity, units: UnitSystem): number {
  switch (q) {
    case 'plain':
    case 'text':
      return value;
    case 'force':
    case 'rating':
    case 'mass':
    case 'density':
      return (value * BEAM_BASE[units][q]) / BEAM_BASE.SI[q];
    default:
      return toSI(value, q, units);
  }
}

const f = (name: string, label: string, q: FieldQuantity, fallback?: FieldSpec['fallback']): FieldSpec => ({
  name,
  label,
  q,
  fallback,
});

export const MATERIAL_FIELDS = (units: UnitSystem): FieldSpec[] => [
  f('kind', 'material family', 'text', 'steel'),
  f('E', "Young's modulus", 'modulus'),
  f('G', 'shear modulus', 'modulus'),
  f('Sy', 'yield strength', 'stress'),
  f('Su', 'tensile strength', 'stress'),
  f('nu', "Poisson's ratio", 'plain'),
  f('density', 'density', 'density', STEEL_DENSITY[units]),
];

export const SEGMENT_FIELDS = [
  f('length', 'length', 'length'),
  f('od', 'outer diameter', 'length'),
  f('id', 'inner diameter', 'length'),
];

export const TORQUE_FIELDS = [
  f('at', 'station', 'length'),
  f('T', 'torque', 'torque'),
  f('Ta', 'alternating torque', 'torque', 0),
];

export const FEATURE_FIELDS = [
  f('type', 'type', 'text'),
  f('at', 'station', 'length'),
  f('form', 'keyseat form', 'text'),
  f('r', 'radius', 'length'),
  f('depth', 'depth', 'length'),
  f('diameter', 'hole diameter', 'length'),
  f('width', 'width', 'length'),
  f('height', 'height', 'length'),
  f('length', 'length', 'length'),
  f('Sy', 'key yield strength', 'stress'),
  f('Kt', 'entered Kt', 'plain'),
  f('Kts', 'entered Kts', 'plain'),
];

export const BENDING_FIELDS = [
  f('at', 'station', 'length'),
  f('Ma', 'alternating moment', 'torque'),
  f('Mm', 'midrange moment', 'torque', 0),
];

export const SUPPORT_FIELDS = [
  f('at', 'station', 'length'),
  f('kind', 'kind', 'text'),
  f('C', 'dynamic load rating', 'rating'),
  f('locating', 'locating', 'text', false),
  f('X', 'radial factor X', 'plain'),
  f('Y', 'axial factor Y', 'plain'),
];

export const LOAD_FIELDS = [
  f('kind', 'kind', 'text', 'force'),
  f('at', 'station', 'length'),
  f('Fy', 'force Fy', 'force', 0),
  f('Fz', 'force Fz', 'force', 0),
  f('Fx', 'axial force Fx', 'force', 0),
  f('T', 'transmitted torque', 'torque'),
  f('pitchDiameter', 'pitch diameter', 'length'),
  f('diameter', 'diameter', 'length'),
  f('pressureAngle', 'pressure angle', 'plain', 20),
  f('helixAngle', 'helix angle', 'plain', 0),
  f('direction', 'direction', 'plain', 0),
  f('pullFactor', 'pull factor', 'plain'),
];

export const MASS_FIELDS = [f('at', 'station', 'length'), f('mass', 'mass', 'mass')];

export const FATIGUE_FIELDS = [
  f('surface', 'surface finish', 'text'),
  f('surfaceTable', 'surface-factor table', 'text', '9th-10th'),
  f('reliability', 'reliability', 'plain', 50),
  f('temperature', 'temperature', 'temperature'),
  f('kd', 'temperature factor', 'plain'),
  f('kc', 'load factor', 'plain', 1),
  f('kf', 'miscellaneous factor', 'plain', 1),
  f('kfOnMidrange', 'Kf on midrange', 'text', true),
  f('alternatingTorqueFraction', 'alternating torque fraction', 'plain', 0),
  f('SePrime', 'entered endurance limit', 'stress'),
];

import { UNIT_LABELS, type Quantity, type UnitSystem } from './units';

type FieldName = [name: string, quantity: Quantity | null];

// Human names and quantities of the input fields, so a message can say "outer diameter … mm".
const FIELDS: Record<string, FieldName> = {
  length: ['length', 'length'],
  od: ['outer diameter', 'length'],
  id: ['inner diameter', 'length'],
  at: ['station', 'length'],
  r: ['radius', 'length'],
  width: ['width', 'length'],
  height: ['height', 'length'],
  depth: ['depth', 'length'],
  diameter: ['hole diameter', 'length'],
  T: ['torque', 'torque'],
  Ta: ['alternating torque', 'torque'],
  Ma: ['alternating bending moment', 'torque'],
  Mm: ['midrange bending moment', 'torque'],
  power: ['power', 'power'],
  speed: ['speed', 'speed'],
  E: ["Young's modulus", 'modulus'],
  G: ['shear modulus', 'modulus'],
  Sy: ['yield strength', 'stress'],
  Su: ['ultimate strength', 'stress'],
  SePrime: ['unmodified endurance limit', 'stress'],
  temperature: ['temperature', 'temperature'],
  Kt: ['Kt', null],
  Kts: ['Kts', null],
  kc: ['load factor kc', null],
  kd: ['temperature factor kd', null],
  kf: ['miscellaneous-effects factor kf', null],
  alternatingTorqueFraction: ['alternating torque fraction', null],
};

/** Human name and unit (with a leading space) of the field a path ends in. */
export function fieldOf(path: readonly PropertyKey[], system: UnitSystem | null): { name: string; unit: string } {
  const key = path[path.length - 1];
  const known = typeof key === 'string' ? FIELDS[key] : undefined;
  if (!known) return { name: typeof key === 'string' ? key : 'entry', unit: '' };
  const unit = known[1] && system ? ` ${UNIT_LABELS[system][known[1]]}` : '';
  return { name: known[0], unit };
}

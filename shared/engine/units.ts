// The engine computes in one internal base (mm, N·mm, MPa, rad) and converts only at the edges,
// so SI and US inputs of the same shaft give the same physical answer.
export type UnitSystem = 'SI' | 'US';

export type Quantity =
  | 'length'
  | 'torque'
  | 'stress'
  | 'modulus'
  | 'power'
  | 'speed'
  | 'angle'
  | 'twistPerLength'
  | 'J'
  | 'Zp'
  | 'temperature';

// Exact by definition (1 in = 25.4 mm) or NIST SP 811 conversion factors (from memory).
export const MM_PER_IN = 25.4;
export const N_PER_LBF = 4.4482216152605;
export const MPA_PER_KSI = 6.894757293168361;
export const W_PER_HP = 745.6998715822702;
const DEG_PER_RAD = 180 / Math.PI;

export type FactorTable = Record<Exclude<Quantity, 'temperature'>, number>;

/** Multiply a value in the system's display unit by this to get the internal base unit. */
export const BASE_PER_UNIT: Record<UnitSystem, FactorTable> = {
  SI: {
    length: 1,
    torque: 1000,
    stress: 1,
    modulus: 1000,
    power: 1000,
    speed: 1,
    angle: 1 / DEG_PER_RAD,
    twistPerLength: 1 / (DEG_PER_RAD * 1000),
    J: 1,
    Zp: 1,
  },
  US: {
    length: MM_PER_IN,
    torque: N_PER_LBF * MM_PER_IN,
    stress: MPA_PER_KSI,
    modulus: MPA_PER_KSI * 1000,
    power: W_PER_HP,
    speed: 1,
    angle: 1 / DEG_PER_RAD,
    twistPerLength: 1 / (DEG_PER_RAD * 12 * MM_PER_IN),
    J: MM_PER_IN ** 4,
    Zp: MM_PER_IN ** 3,
  },
};

export const UNIT_LABELS: Record<UnitSystem, Record<Quantity, string>> = {
  SI: {
    length: 'mm',
    torque: 'N·m',
    stress: 'MPa',
    modulus: 'GPa',
    power: 'kW',
    speed: 'rpm',
    angle: 'deg',
    twistPerLength: 'deg/m',
    J: 'mm⁴',
    Zp: 'mm³',
    temperature: '°C',
  },
  US: {
    length: 'in',
    torque: 'lbf·in',
    stress: 'ksi',
    modulus: 'Mpsi',
    power: 'hp',
    speed: 'rpm',
    angle: 'deg',
    twistPerLength: 'deg/ft',
    J: 'in⁴',
    Zp: 'in³',
    temperature: '°F',
  },
};

/** Convert from the system's display unit to the internal base (mm, N·mm, MPa, W, rad, rad/mm). */
export function toBase(value: number, quantity: Quantity, system: UnitSystem): number {
  if (quantity === 'temperature') return system === 'SI' ? value : (value - 32) / 1.8;
  return value * BASE_PER_UNIT[system][quantity];
}

export function fromBase(value: number, quantity: Quantity, system: UnitSystem): number {
  if (quantity === 'temperature') return system === 'SI' ? value : value * 1.8 + 32;
  return value / BASE_PER_UNIT[system][quantity];
}

/** A US-customary value expressed in the SI calc unit (in → mm, lbf·in → N·m, ksi → MPa, hp → kW …). */
export function toSI(value: number, quantity: Quantity, from: UnitSystem = 'US'): number {
  return fromBase(toBase(value, quantity, from), quantity, 'SI');
}

/** An SI calc-unit value expressed in the other system's unit (mm → in, N·m → lbf·in, MPa → ksi …). */
export function fromSI(value: number, quantity: Quantity, to: UnitSystem = 'US'): number {
  return fromBase(toBase(value, quantity, 'SI'), quantity, to);
}

import type { UnitSystem } from './units';

/*
 * Plausible ranges per quantity, in each unit system's own units (round numbers in both, so a
 * message quotes what the author typed against a limit they recognise). They are far wider than any
 * shaft needs and exist so that no arithmetic in the engine can overflow to Infinity or collapse to
 * 0 or NaN: with every entry inside them, every stress, factor and angle stays finite (worked out
 * in docs/references.md, "Plausible input ranges"). Common practice, no source. Signed loads may
 * also be exactly 0. Each US range contains the SI one converted, so a shaft valid in SI units
 * is valid when entered in US units too.
 */
export type RangeKind =
  'length' | 'torque' | 'power' | 'speed' | 'modulus' | 'stress' | 'temperature' | 'factor' | 'Kt' | 'fraction';

export const PLAUSIBLE_RANGES: Record<UnitSystem, Record<RangeKind, readonly [number, number]>> = {
  SI: {
    length: [0.001, 1e5],
    torque: [1e-6, 1e10],
    power: [1e-6, 1e6],
    speed: [0.001, 1e6],
    modulus: [0.1, 2000],
    stress: [0.1, 20000],
    temperature: [-273.15, 1500],
    factor: [0.01, 10],
    Kt: [1, 20],
    fraction: [0, 100],
  },
  US: {
    length: [0.00003, 4000],
    torque: [1e-6, 1e11],
    power: [1e-6, 2e6],
    speed: [0.001, 1e6],
    modulus: [0.01, 300],
    stress: [0.01, 3000],
    temperature: [-459.67, 2700],
    factor: [0.01, 10],
    Kt: [1, 20],
    fraction: [0, 100],
  },
};

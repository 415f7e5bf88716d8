import { safetyFactor } from './combined';
import type { KeyCheck } from './result';

export const KEY_METHOD =
  'Key on the shaft surface: F = T/(d/2); shear τ = F/(w·l), n = 0.577·Sy/τ; ' +
  'bearing σ = F/(l·h/2), n = Sy/σ with the key Sy (Shigley 9th §7-7, Example 7-6, from memory)';

export interface KeyDims {
  width?: number;
  height?: number;
  length?: number;
  Sy?: number;
}

/**
 * Shear and bearing of a square or rectangular key for the peak torque (N·mm), shaft diameter d
 * (mm) and key dimensions in mm, MPa. Fields stay null where the needed dimension is not given.
 */
export function keyCheck(Tpeak: number, d: number, key: KeyDims): KeyCheck | null {
  if (key.width === undefined || key.length === undefined) return null;
  const F = Math.abs(Tpeak) / (d / 2);
  const shear = F / (key.width * key.length);
  const bearing = key.height === undefined ? null : F / ((key.length * key.height) / 2);
  return {
    shearStress: shear,
    bearingStress: bearing,
    // Distortion energy gives the shear yield strength Ssy = 0.577·Sy (Shigley 9th Eq. 5-21).
    shearSafety: key.Sy === undefined ? null : safetyFactor(0.577 * key.Sy, shear),
    bearingSafety: key.Sy === undefined || bearing === null ? null : safetyFactor(key.Sy, bearing),
    method: KEY_METHOD,
  };
}

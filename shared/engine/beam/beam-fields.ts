import type { FieldInfo } from '../result';
import { UNIT_LABELS, type UnitSystem } from '../units';
import { LIFE_METHOD } from './bearing-life';
import { BEAM_LABELS } from './beam-units';

type Unit = 'force' | 'rating' | 'mass' | 'length' | 'torque' | 'speed' | 'rad' | 'h' | 'Mrev' | '1';
type Spec = [field: string, unit: Unit, formula: string];

// Unit and formula of every numeric field the beam model adds to the result.
const SPECS: Spec[] = [
  ['Fy', 'force', 'force on the shaft along +y (a support: its reaction, from K·u − f of the beam model)'],
  ['Fz', 'force', 'force on the shaft along +z (a support: its reaction)'],
  ['F', 'force', 'resultant radial reaction F = √(Fy² + Fz²)'],
  ['Fa', 'force', 'axial reaction |Σ Fx|, taken by the locating bearing'],
  ['Fx', 'force', 'axial force on the shaft along +x (a helical gear: Wa = Wt·tan ψ)'],
  ['P', 'force', 'equivalent dynamic load P = X·Fr + Y·Fa, or P = Fr without axial load (ISO 281)'],
  ['p', '1', 'life exponent: 3 ball, 10/3 roller (ISO 281)'],
  ['C', 'rating', 'basic dynamic load rating (entered)'],
  ['L10', 'Mrev', 'L10 = (C/P)^p (ISO 281)'],
  ['L10h', 'h', LIFE_METHOD],
  ['slope', 'rad', 'resultant slope √(v′² + w′²)'],
  ['slopeY', 'rad', 'slope dv/dx in the x–y plane'],
  ['slopeZ', 'rad', 'slope dw/dx in the x–z plane'],
  ['y', 'length', 'deflection v along +y'],
  ['z', 'length', 'deflection w along +z'],
  ['deflection', 'length', 'resultant transverse deflection √(v² + w²)'],
  ['max', 'length', 'largest resultant deflection along the shaft (8 samples per element of the exact cubic)'],
  ['Vy', 'force', 'shear force Vy = Σ Fy left of the section'],
  ['Vz', 'force', 'shear force Vz = Σ Fz left of the section'],
  ['My', 'torque', 'bending moment in the x–y plane, My = Σ Fy·(x − xF) − Σ C (sign: M = EI·v″)'],
  ['Mz', 'torque', 'bending moment in the x–z plane, Mz = Σ Fz·(x − xF) − Σ C'],
  ['M', 'torque', 'resultant bending moment √(My² + Mz²) from the beam model'],
  ['rpm', 'speed', 'first bending critical speed n = 60·ω₁/(2π), ω₁² the smallest eigenvalue of K·φ = ω²·M·φ'],
  ['ratio', '1', 'critical speed / operating speed'],
  ['operatingSpeed', 'speed', 'operating speed'],
  ['speed', 'speed', "operating speed: the speed entry, else a power entry's speed"],
  ['totalMass', 'mass', 'shaft mass Σ ρ·A·L plus attached masses'],
  ['mass', 'mass', 'attached mass (entered)'],
];

function unitOf(u: Unit, system: UnitSystem): string {
  if (u === '1' || u === 'rad' || u === 'h') return u;
  if (u === 'Mrev') return '10⁶ rev';
  if (u === 'length' || u === 'torque' || u === 'speed') return UNIT_LABELS[system][u];
  return BEAM_LABELS[system][u];
}

export function beamFields(system: UnitSystem): Record<string, FieldInfo> {
  const out: Record<string, FieldInfo> = {};
  for (const [field, u, formula] of SPECS) out[field] = { unit: unitOf(u, system), formula };
  return out;
}

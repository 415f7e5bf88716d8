import { fromBase, toBase, type UnitSystem } from './units';

export const POWER_METHOD = 'P = T·ω, ω = 2π·n/60 (T = 9549.2966·P/n in N·m, kW, rpm; 63 025·hp/n in lbf·in)';

/**
 * Torque carried at a given power and speed, in the calc's torque unit (N·m or lbf·in).
 * Power in kW (SI) or hp (US), speed in rpm. The sign of the power is kept: a positive power is
 * a driving torque, a negative one a power take-off.
 */
export function torqueFromPower(power: number, speed: number, system: UnitSystem): number {
  const watts = toBase(power, 'power', system);
  const omega = (2 * Math.PI * speed) / 60;
  // W / (rad/s) = N·m; the internal torque base is N·mm.
  return fromBase((watts / omega) * 1000, 'torque', system);
}

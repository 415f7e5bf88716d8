import { fromBase, toBase, type UnitSystem } from './units';

export const POWER_METHOD = 'P = T·ω, ω = 2π·n/60 (T = 9549.2966·P/n in N·m, kW, rpm; 63 025·hp/n in lbf·in)';

/** Torque (N·m or lbf·in) at a power (kW or hp) and speed (rpm); a negative power is a take-off. */
export function torqueFromPower(power: number, speed: number, system: UnitSystem): number {
  const watts = toBase(power, 'power', system);
  const omega = (2 * Math.PI * speed) / 60;
  // W / (rad/s) = N·m; the internal torque base is N·mm.
  return fromBase((watts / omega) * 1000, 'torque', system);
}

import type { CalcResult } from './result';
import { formatNumber as f } from './number-format';
import { STATION_TOLERANCE } from './shaft-geometry';
import { UNIT_LABELS } from './units';

// twistPerLength is per m (SI) or per ft (US) while stations are in mm or in.
const STATION_UNITS_PER_RATE_LENGTH = { SI: 1000, US: 12 } as const;

/**
 * Signed angle of twist (deg) of station b relative to station a: positive when b turns by the
 * right-hand rule about +x relative to a (the convention of torque-diagram.ts), both in the calc's length unit,
 * integrated over the result's torque diagram; twistBetween(r, 0, r.length) equals r.twistTotal.
 * Throws a RangeError naming the station when either lies off the shaft.
 */
export function twistBetween(result: CalcResult, a: number, b: number): number {
  const tol = STATION_TOLERANCE * result.length;
  for (const x of [a, b]) {
    if (!Number.isFinite(x) || x < -tol || x > result.length + tol) {
      const len = UNIT_LABELS[result.units].length;
      throw new RangeError(`station ${f(x)} ${len} is off the shaft (0 to ${f(result.length)} ${len})`);
    }
  }
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  let sum = 0;
  for (const p of result.torqueDiagram) {
    const overlap = Math.min(hi, p.end) - Math.max(lo, p.start);
    if (overlap > 0) sum += p.twistPerLength * overlap;
  }
  sum /= STATION_UNITS_PER_RATE_LENGTH[result.units];
  return b >= a ? sum : -sum;
}

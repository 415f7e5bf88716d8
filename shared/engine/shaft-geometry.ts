/** Where a station falls on the shaft: the segment(s) touching it; left !== right at a joint. */
export interface Location {
  left: number;
  right: number;
}

const OFF_SHAFT: Location = { left: -1, right: -1 };

/** Relative tolerance for "this station is that joint": summed decimal lengths are not exact in binary. */
export const STATION_TOLERANCE = 1e-7;

/** Joint stations: bounds[i] is the start of segment i and bounds[n] the shaft length. */
export function segmentBounds(lengths: readonly number[]): number[] {
  const bounds = [0];
  let x = 0;
  for (const length of lengths) {
    x += length;
    bounds.push(x);
  }
  return bounds;
}

export function locate(x: number, bounds: readonly number[]): Location {
  const n = bounds.length - 1;
  const tol = STATION_TOLERANCE * bounds[n];
  if (x < -tol || x > bounds[n] + tol) return OFF_SHAFT;
  for (let i = 0; i < n; i++) {
    if (Math.abs(x - bounds[i + 1]) <= tol) return i + 1 < n ? { left: i, right: i + 1 } : { left: i, right: i };
    if (x < bounds[i + 1]) return { left: i, right: i };
  }
  return { left: n - 1, right: n - 1 };
}

/** Nearest internal joint to x (for messages), or -1 on a one-segment shaft. */
export function nearestJoint(x: number, bounds: readonly number[]): number {
  let best = -1;
  for (let j = 1; j < bounds.length - 1; j++) {
    if (best < 0 || Math.abs(bounds[j] - x) < Math.abs(bounds[best] - x)) best = j;
  }
  return best;
}

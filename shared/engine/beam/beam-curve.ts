import type { DeflectionPoint } from './beam-result';
import type { BeamSolution } from './beam-solve';
import { hermiteInto } from './stiffness';

/* Deflection and slope along the shaft from the exact Hermite interpolation inside each element. */
export interface CurvePoint {
  at: number;
  y: number;
  z: number;
  sy: number;
  sz: number;
}

// Scratch for the interpolation (this runs on every keystroke; no garbage per point).
const Y = new Float64Array(2);
const Z = new Float64Array(2);

export function pointAt(beam: BeamSolution, e: number, x: number): CurvePoint {
  hermiteInto(beam.mesh, beam.y.u, e, x, Y);
  hermiteInto(beam.mesh, beam.z.u, e, x, Z);
  return { at: x, y: Y[0], z: Z[0], sy: Y[1], sz: Z[1] };
}

/** Point at a node (its own values, no interpolation). */
export function nodePoint(beam: BeamSolution, i: number): CurvePoint {
  const { y, z } = beam;
  return { at: beam.mesh.x[i], y: y.u[2 * i], z: z.u[2 * i], sy: y.u[2 * i + 1], sz: z.u[2 * i + 1] };
}

/** Squared resultant deflection at x in element e. */
function size2(beam: BeamSolution, e: number, x: number): number {
  hermiteInto(beam.mesh, beam.y.u, e, x, Y);
  hermiteInto(beam.mesh, beam.z.u, e, x, Z);
  return Y[0] * Y[0] + Z[0] * Z[0];
}

/*
 * Largest resultant deflection: the best node or midpoint, then a golden-section search over the
 * two elements beside it (the resultant of two cubics is smooth there, and unimodal near its peak).
 */
function refineMax(beam: BeamSolution, e0: number, bestAt: number, best2: number): [number, number] {
  const x = beam.mesh.x;
  const [lo, hi] = [Math.max(0, e0 - 1), Math.min(x.length - 2, e0 + 1)];
  const f = (t: number): number => {
    let e = lo;
    while (e < hi && t > x[e + 1]) e++;
    return size2(beam, e, t);
  };
  let [a, b] = [x[lo], x[hi + 1]];
  const g = (Math.sqrt(5) - 1) / 2;
  let [c, d] = [b - g * (b - a), a + g * (b - a)];
  let [fc, fd] = [f(c), f(d)];
  for (let i = 0; i < 22; i++) {
    // Plain assignments, not destructuring: this loop runs on every keystroke and must not allocate.
    if (fc > fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = f(d);
    }
  }
  const [t, v] = fc > fd ? [c, fc] : [d, fd];
  return v > best2 ? [t, v] : [bestAt, best2];
}

/** Curve at every node and element midpoint, and the largest resultant deflection and its station. */
export function deflectionCurve(
  beam: BeamSolution,
  length: number,
): { curve: DeflectionPoint[]; max: number; at: number } {
  const x = beam.mesh.x;
  const [uy, uz] = [beam.y.u, beam.z.u];
  const curve: DeflectionPoint[] = [];
  let [best2, bestAt, bestE] = [-1, 0, 0];
  // Points are written straight from the nodal values or the scratch interpolation (no temporaries).
  const out = (at: number, y: number, z: number, sy: number, sz: number, e: number): void => {
    const d2 = y * y + z * z;
    curve.push({
      at: at / length,
      y: y / length,
      z: z / length,
      deflection: Math.sqrt(d2) / length,
      slopeY: sy,
      slopeZ: sz,
      slope: Math.hypot(sy, sz),
    });
    if (d2 > best2) {
      best2 = d2;
      bestAt = at;
      bestE = e;
    }
  };
  const last = x.length - 1;
  for (let e = 0; e < last; e++) {
    out(x[e], uy[2 * e], uz[2 * e], uy[2 * e + 1], uz[2 * e + 1], e);
    const mid = (x[e] + x[e + 1]) / 2;
    hermiteInto(beam.mesh, uy, e, mid, Y);
    hermiteInto(beam.mesh, uz, e, mid, Z);
    out(mid, Y[0], Z[0], Y[1], Z[1], e);
  }
  out(x[last], uy[2 * last], uz[2 * last], uy[2 * last + 1], uz[2 * last + 1], last - 1);
  const [at, peak2] = best2 > 0 ? refineMax(beam, bestE, bestAt, best2) : [bestAt, 0];
  return { curve, max: Math.sqrt(peak2) / length, at: at / length };
}

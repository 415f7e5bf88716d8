import type { DeflectionPoint } from './beam-result';
import type { BeamSolution } from './beam-solve';
import { hermite } from './stiffness';

/* Deflection and slope along the shaft from the exact Hermite interpolation inside each element. */
export interface CurvePoint { at: number; y: number; z: number; sy: number; sz: number }

export function pointAt(beam: BeamSolution, e: number, x: number): CurvePoint {
  const [y, sy] = hermite(beam.mesh, beam.y.u, e, x);
  const [z, sz] = hermite(beam.mesh, beam.z.u, e, x);
  return { at: x, y, z, sy, sz };
}

/** Point at a node (its own values, no interpolation). */
export function nodePoint(beam: BeamSolution, i: number): CurvePoint {
  const { y, z } = beam;
  return { at: beam.mesh.x[i], y: y.u[2 * i], z: z.u[2 * i], sy: y.u[2 * i + 1], sz: z.u[2 * i + 1] };
}

const SAMPLES = 8;

/** Curve at every node and element midpoint, and the largest resultant deflection over 8 samples per element. */
export function deflectionCurve(beam: BeamSolution, length: number): { curve: DeflectionPoint[]; max: number; at: number } {
  const x = beam.mesh.x;
  const curve: DeflectionPoint[] = [];
  let [max, at] = [0, 0];
  const out = (p: CurvePoint): void => {
    curve.push({ at: p.at / length, y: p.y / length, z: p.z / length, deflection: Math.hypot(p.y, p.z) / length,
      slopeY: p.sy, slopeZ: p.sz, slope: Math.hypot(p.sy, p.sz) });
  };
  for (let e = 0; e < x.length - 1; e++) {
    out(nodePoint(beam, e));
    out(pointAt(beam, e, (x[e] + x[e + 1]) / 2));
    for (let s = 0; s < SAMPLES; s++) {
      const p = pointAt(beam, e, x[e] + ((x[e + 1] - x[e]) * s) / SAMPLES);
      const d = Math.hypot(p.y, p.z);
      if (d > max) [max, at] = [d, p.at];
    }
  }
  const last = nodePoint(beam, x.length - 1);
  out(last);
  if (Math.hypot(last.y, last.z) > max) [max, at] = [Math.hypot(last.y, last.z), last.at];
  return { curve, max: max / length, at: at / length };
}

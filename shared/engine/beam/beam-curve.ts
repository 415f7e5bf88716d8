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

const size = (p: CurvePoint): number => Math.hypot(p.y, p.z);

/*
 * Largest resultant deflection: the best node or midpoint, then a golden-section search over the
 * two elements beside it (the resultant of two cubics is smooth there, and unimodal near its peak).
 */
function refineMax(beam: BeamSolution, e0: number, best: CurvePoint): CurvePoint {
  const x = beam.mesh.x;
  const [lo, hi] = [Math.max(0, e0 - 1), Math.min(x.length - 2, e0 + 1)];
  const at = (t: number): CurvePoint => {
    let e = lo;
    while (e < hi && t > x[e + 1]) e++;
    return pointAt(beam, e, t);
  };
  let [a, b] = [x[lo], x[hi + 1]];
  const g = (Math.sqrt(5) - 1) / 2;
  let [pc, pd] = [at(b - g * (b - a)), at(a + g * (b - a))];
  for (let i = 0; i < 30; i++) {
    if (size(pc) > size(pd)) {
      [b, pd] = [pd.at, pc];
      pc = at(b - g * (b - a));
    } else {
      [a, pc] = [pc.at, pd];
      pd = at(a + g * (b - a));
    }
  }
  const found = size(pc) > size(pd) ? pc : pd;
  return size(found) > size(best) ? found : best;
}

/** Curve at every node and element midpoint, and the largest resultant deflection and its station. */
export function deflectionCurve(beam: BeamSolution, length: number): { curve: DeflectionPoint[]; max: number; at: number } {
  const x = beam.mesh.x;
  const curve: DeflectionPoint[] = [];
  let best = nodePoint(beam, 0);
  let bestE = 0;
  const out = (p: CurvePoint, e: number): void => {
    const d = size(p);
    curve.push({ at: p.at / length, y: p.y / length, z: p.z / length, deflection: d / length, slopeY: p.sy, slopeZ: p.sz, slope: Math.hypot(p.sy, p.sz) });
    if (d > size(best)) [best, bestE] = [p, Math.min(e, x.length - 2)];
  };
  for (let e = 0; e < x.length - 1; e++) {
    out(nodePoint(beam, e), e);
    out(pointAt(beam, e, (x[e] + x[e + 1]) / 2), e);
  }
  out(nodePoint(beam, x.length - 1), x.length - 2);
  const peak = size(best) > 0 ? refineMax(beam, bestE, best) : best;
  return { curve, max: size(peak) / length, at: peak.at / length };
}

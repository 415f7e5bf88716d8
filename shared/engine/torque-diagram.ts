import type { Model } from './model';
import { STATION_TOLERANCE } from './shaft-geometry';

/*
 * Internal torque diagram. Sign convention (one, used for torque and twist alike): an external
 * torque is positive when its vector points along +x (right-hand rule, x from the left end). The
 * internal torque T at a section is the torque that the part to its right exerts on the part to its
 * left, positive along +x: the usual convention of mechanics of materials, positive when the vector
 * points away from the cut face. Equilibrium of the left part gives T = −Σ external torques left of
 * the section (= Σ those to the right). The twist rate dφ/dx = T/(G·J) is then the right-hand
 * rotation about +x, so a positive twist of b relative to a means b turns anticlockwise seen from
 * +x looking back towards the left end. A torque applied exactly at a station acts to its right.
 */
export interface Piece {
  start: number;
  end: number;
  segment: number;
  /** Internal torque, N·mm (signed). */
  T: number;
  /** Alternating torque amplitude, N·mm (≥ 0). */
  Ta: number;
  /** Twist rate T/(G·J), rad/mm (signed). */
  rate: number;
}

/** Splits the shaft at every joint and torque station and carries the running torque sum. */
export function buildTorqueDiagram(model: Model): Piece[] {
  const { segs, torques } = model;
  const tol = STATION_TOLERANCE * model.total;
  const taFraction = model.fatigue?.taFraction ?? 0;
  const pieces: Piece[] = [];
  let k = 0;
  let T = 0;
  let Ta = 0;
  for (const seg of segs) {
    let start = seg.start;
    for (;;) {
      for (; k < torques.length && torques[k].at <= start + tol; k++) {
        T -= torques[k].T;
        Ta += torques[k].Ta;
      }
      const end = k < torques.length && torques[k].at < seg.end - tol ? torques[k].at : seg.end;
      const amp = model.hasTa ? Math.abs(Ta) : taFraction * Math.abs(T);
      pieces.push({ start, end, segment: seg.index, T, Ta: amp, rate: T / (seg.mat.G * seg.J) });
      if (end === seg.end) break;
      start = end;
    }
  }
  return pieces;
}

/** Internal torque at a station: where it jumps, the side of larger magnitude (conservative). */
export function torqueAt(pieces: readonly Piece[], x: number, tol: number): { T: number; Ta: number } {
  let T = 0;
  let Ta = 0;
  for (const p of pieces) {
    if (p.start - tol > x || p.end + tol < x) continue;
    if (Math.abs(p.T) > Math.abs(T)) T = p.T;
    if (p.Ta > Ta) Ta = p.Ta;
  }
  return { T, Ta };
}

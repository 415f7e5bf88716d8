import { solve } from './band-solver';
import type { BeamSolution } from './beam-solve';
import { nodeAt } from './mesh';
import { assembleMass } from './stiffness';

/*
 * First bending natural frequency of the same beam model: smallest eigenvalue of K·φ = ω²·M·φ with
 * the consistent mass matrix of the shaft plus the attached masses at their nodes, by inverse
 * iteration with the Rayleigh quotient (Bathe, Finite Element Procedures, §11.2, from memory).
 * The start load is deliberately unsymmetric so an antisymmetric first mode (two equal spans) is
 * not missed. For a shaft the first bending critical speed equals this frequency (no gyroscopic
 * or bearing-flexibility effects: rigid supports).
 */
export const CRITICAL_SPEED_METHOD =
  'eigenvalue of the beam model: K·φ = ω²·M·φ, consistent mass matrix plus ' +
  'attached point masses, inverse iteration (rigid simple supports, no gyroscopic effect)';

const MAX_ITERATIONS = 300;
// On the eigenvalue ω²: the speed is then good to about 5e-8, far below any input's precision.
const TOLERANCE = 1e-7;

export interface Eigen {
  omega: number;
  totalMass: number;
}

export function firstBendingFrequency(
  beam: BeamSolution,
  masses: readonly { at: number; mass: number }[],
): Eigen | null {
  const { mesh, factored, supportNodes } = beam;
  const points = masses.map((m) => ({ node: nodeAt(mesh, m.at), mass: m.mass }));
  const M = assembleMass(mesh, points);
  for (const i of supportNodes) M.fix(2 * i);
  const n = mesh.x.length * 2;
  const fixed = new Uint8Array(n);
  for (const i of supportNodes) fixed[2 * i] = 1;
  // Mx holds M·x of the current iterate; after normalising y, M·y scaled is the next M·x (one product per step).
  const Mx = new Float64Array(n);
  for (let i = 0; i < n; i++) Mx[i] = fixed[i] ? 0 : 1 + (0.7 * i) / n;
  const y = new Float64Array(n);
  const My = new Float64Array(n);
  let lambda = 0;
  for (let it = 0; it < MAX_ITERATIONS; it++) {
    solve(factored, Mx, y);
    M.multiply(y, My);
    let num = 0;
    let den = 0;
    for (let i = 0; i < n; i++) {
      if (fixed[i]) My[i] = 0;
      num += y[i] * Mx[i];
      den += y[i] * My[i];
    }
    if (!(den > 0)) return null;
    const next = num / den;
    const scale = 1 / Math.sqrt(den);
    for (let i = 0; i < n; i++) Mx[i] = My[i] * scale;
    const done = Math.abs(next - lambda) <= TOLERANCE * next;
    lambda = next;
    if (done) break;
  }
  let total = 0;
  for (let e = 0; e < mesh.rhoA.length; e++) total += mesh.rhoA[e] * (mesh.x[e + 1] - mesh.x[e]);
  for (const p of points) total += p.mass;
  return Number.isFinite(lambda) && lambda > 0 ? { omega: Math.sqrt(lambda), totalMass: total } : null;
}

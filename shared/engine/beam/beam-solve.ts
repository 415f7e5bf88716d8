import type { Model } from '../model';
import { factor, solve, type BandMatrix } from './band-solver';
import { buildMesh, nodeAt, type Mesh } from './mesh';
import type { PointLoad } from './resolve-loads';
import { assembleStiffness, nodalForce } from './stiffness';

/*
 * Static solution of the shaft on rigid simple supports at the bearing centres, in the two planes
 * separately (the round shaft bends alike in both). Reactions follow from the unconstrained
 * stiffness, so two bearings (statically determinate) and a line shaft on three or more are
 * solved the same way.
 */
export interface Plane {
  /** Nodal deflections and slopes, [v0, v0′, v1, v1′, …] (mm, rad). */
  u: Float64Array;
  /** Reaction of each support on the shaft, N. */
  R: number[];
}

export interface BeamSolution {
  mesh: Mesh;
  /** Factored stiffness with the supports fixed (reused by the critical-speed solution). */
  factored: BandMatrix;
  supportNodes: number[];
  loads: PointLoad[];
  y: Plane;
  z: Plane;
  /** Stations (mm) of the key nodes with the moments just left and right of each (N·mm). */
  diagram: DiagramPoint[];
}

export interface DiagramPoint {
  at: number;
  Vy: number;
  Vz: number;
  My: number;
  Mz: number;
}

export class SingularBeamError extends Error {}

function planeLoads(mesh: Mesh, loads: readonly PointLoad[], plane: 'y' | 'z'): Float64Array {
  const f = new Float64Array(mesh.x.length * 2);
  for (const p of loads) {
    const i = nodeAt(mesh, p.at);
    f[2 * i] += plane === 'y' ? p.Fy : p.Fz;
    f[2 * i + 1] += plane === 'y' ? p.Cy : p.Cz;
  }
  return f;
}

function solvePlane(mesh: Mesh, U: BandMatrix, nodes: number[], f: Float64Array): Plane {
  const rhs = f.slice();
  for (const i of nodes) rhs[2 * i] = 0;
  const u = new Float64Array(rhs.length);
  solve(U, rhs, u);
  for (const i of nodes) u[2 * i] = 0;
  return { u, R: nodes.map((i) => nodalForce(mesh, u, i) - f[2 * i]) };
}

/*
 * Shear and moment by statics from the applied forces and the solved reactions: V = Σ F left of
 * the section, M = Σ F·(x − xF) − Σ C (sign such that M = EI·v″). Two points where V or M jumps.
 */
function diagram(mesh: Mesh, s: Omit<BeamSolution, 'diagram'>): DiagramPoint[] {
  const acts: { at: number; Fy: number; Fz: number; Cy: number; Cz: number }[] = [
    ...s.loads,
    ...s.supportNodes.map((n, k) => ({ at: mesh.x[n], Fy: s.y.R[k], Fz: s.z.R[k], Cy: 0, Cz: 0 })),
  ].sort((a, b) => a.at - b.at);
  const out: DiagramPoint[] = [];
  const nodes = acts.map((a) => nodeAt(mesh, a.at));
  let Vy = 0;
  let Vz = 0;
  let My = 0;
  let Mz = 0;
  let x0 = 0;
  let j = 0;
  for (let i = 0; i < mesh.x.length; i++) {
    if (!mesh.isKey[i]) continue;
    const x = mesh.x[i];
    My += Vy * (x - x0);
    Mz += Vz * (x - x0);
    x0 = x;
    if (j < acts.length && nodes[j] === i && i > 0) out.push({ at: x, Vy, Vz, My, Mz });
    for (; j < acts.length && nodes[j] === i; j++) {
      const a = acts[j];
      Vy += a.Fy;
      Vz += a.Fz;
      My -= a.Cy;
      Mz -= a.Cz;
    }
    out.push({ at: x, Vy, Vz, My, Mz });
  }
  return out;
}

/*
 * Two supports are statically determinate: their reactions from ΣF = 0 and ΣM = 0 are exact and
 * keep full precision even beside a very short element, where K·u − f loses a few digits.
 */
function determinate(mesh: Mesh, nodes: number[], loads: readonly PointLoad[], plane: 'y' | 'z'): number[] {
  const [a, b] = [mesh.x[nodes[0]], mesh.x[nodes[1]]];
  let [sumF, sumM] = [0, 0];
  for (const p of loads) {
    const F = plane === 'y' ? p.Fy : p.Fz;
    sumF += F;
    // Moment about support a: M = Σ F·(x − xF) − Σ C vanishes beyond the right end, so with
    // ΣF = 0 it follows that Σ F·(xF − a) + Σ C = 0.
    sumM += F * (mesh.x[nodeAt(mesh, p.at)] - a) + (plane === 'y' ? p.Cy : p.Cz);
  }
  const Rb = -sumM / (b - a);
  return [-sumF - Rb, Rb];
}

/** Solves the beam; `stations` (mm) become nodes, `densities` (t/mm³) are per segment. */
export function solveBeam(
  model: Model,
  supports: readonly number[],
  loads: PointLoad[],
  stations: number[],
  densities: readonly number[],
): BeamSolution {
  const mesh = buildMesh(model, supports, stations, densities);
  const U = assembleStiffness(mesh);
  const supportNodes = supports.map((x) => nodeAt(mesh, x));
  for (const i of supportNodes) U.fix(2 * i);
  if (!factor(U)) throw new SingularBeamError('the shaft is not held: supports or stiffness missing');
  const y = solvePlane(mesh, U, supportNodes, planeLoads(mesh, loads, 'y'));
  const z = solvePlane(mesh, U, supportNodes, planeLoads(mesh, loads, 'z'));
  if (supportNodes.length === 2) {
    y.R = determinate(mesh, supportNodes, loads, 'y');
    z.R = determinate(mesh, supportNodes, loads, 'z');
  }
  const base = { mesh, factored: U, supportNodes, loads, y, z };
  return { ...base, diagram: diagram(mesh, base) };
}

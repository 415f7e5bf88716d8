import { BandMatrix } from './band-solver';
import type { Mesh } from './mesh';

/*
 * Euler–Bernoulli beam elements with cubic Hermite shape functions, two unknowns per node
 * (deflection v, slope v′). With constant EI on an element and loads only at nodes they give the
 * exact static solution (e.g. Cook, Malkus, Plesha, Concepts and Applications of FEA, 4th ed.,
 * §2.4, from memory). The consistent mass matrix is the standard ρA·L/420 form (same source).
 */
export function assembleStiffness(mesh: Mesh): BandMatrix {
  const n = mesh.x.length * 2;
  const K = new BandMatrix(n, 3);
  for (let e = 0; e < mesh.EI.length; e++) {
    const L = mesh.x[e + 1] - mesh.x[e];
    const c = mesh.EI[e] / L ** 3;
    const i = 2 * e;
    K.add(i, i, 12 * c); K.add(i, i + 1, 6 * L * c); K.add(i, i + 2, -12 * c); K.add(i, i + 3, 6 * L * c);
    K.add(i + 1, i + 1, 4 * L * L * c); K.add(i + 1, i + 2, -6 * L * c); K.add(i + 1, i + 3, 2 * L * L * c);
    K.add(i + 2, i + 2, 12 * c); K.add(i + 2, i + 3, -6 * L * c);
    K.add(i + 3, i + 3, 4 * L * L * c);
  }
  return K;
}

export function assembleMass(mesh: Mesh, pointMasses: readonly { node: number; mass: number }[]): BandMatrix {
  const n = mesh.x.length * 2;
  const M = new BandMatrix(n, 3);
  for (let e = 0; e < mesh.EI.length; e++) {
    const L = mesh.x[e + 1] - mesh.x[e];
    const c = (mesh.rhoA[e] * L) / 420;
    const i = 2 * e;
    M.add(i, i, 156 * c); M.add(i, i + 1, 22 * L * c); M.add(i, i + 2, 54 * c); M.add(i, i + 3, -13 * L * c);
    M.add(i + 1, i + 1, 4 * L * L * c); M.add(i + 1, i + 2, 13 * L * c); M.add(i + 1, i + 3, -3 * L * L * c);
    M.add(i + 2, i + 2, 156 * c); M.add(i + 2, i + 3, -22 * L * c);
    M.add(i + 3, i + 3, 4 * L * L * c);
  }
  for (const p of pointMasses) M.add(2 * p.node, 2 * p.node, p.mass);
  return M;
}

/** Transverse nodal force of the unconstrained stiffness, (K·u) at node i's deflection unknown. */
export function nodalForce(mesh: Mesh, u: Float64Array, node: number): number {
  let f = 0;
  for (const e of [node - 1, node]) {
    if (e < 0 || e >= mesh.EI.length) continue;
    const L = mesh.x[e + 1] - mesh.x[e];
    const c = mesh.EI[e] / L ** 3;
    const [v1, t1, v2, t2] = [u[2 * e], u[2 * e + 1], u[2 * e + 2], u[2 * e + 3]];
    f += e === node ? c * (12 * v1 + 6 * L * t1 - 12 * v2 + 6 * L * t2) : c * (-12 * v1 - 6 * L * t1 + 12 * v2 - 6 * L * t2);
  }
  return f;
}

/** Deflection and slope at x inside element e from its Hermite shape functions. */
export function hermite(mesh: Mesh, u: Float64Array, e: number, x: number): [number, number] {
  const x0 = mesh.x[e];
  const L = mesh.x[e + 1] - x0;
  const s = (x - x0) / L;
  const [v1, t1, v2, t2] = [u[2 * e], u[2 * e + 1], u[2 * e + 2], u[2 * e + 3]];
  const N1 = 1 - 3 * s * s + 2 * s ** 3;
  const N2 = L * (s - 2 * s * s + s ** 3);
  const N3 = 3 * s * s - 2 * s ** 3;
  const N4 = L * (-s * s + s ** 3);
  const d1 = (-6 * s + 6 * s * s) / L;
  const d2 = 1 - 4 * s + 3 * s * s;
  const d3 = (6 * s - 6 * s * s) / L;
  const d4 = -2 * s + 3 * s * s;
  return [N1 * v1 + N2 * t1 + N3 * v2 + N4 * t2, d1 * v1 + d2 * t1 + d3 * v2 + d4 * t2];
}

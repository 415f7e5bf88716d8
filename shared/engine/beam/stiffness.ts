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
    K.add(i, i, 12 * c);
    K.add(i, i + 1, 6 * L * c);
    K.add(i, i + 2, -12 * c);
    K.add(i, i + 3, 6 * L * c);
    K.add(i + 1, i + 1, 4 * L * L * c);
    K.add(i + 1, i + 2, -6 * L * c);
    K.add(i + 1, i + 3, 2 * L * L * c);
    K.add(i + 2, i + 2, 12 * c);
    K.add(i + 2, i + 3, -6 * L * c);
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
    M.add(i, i, 156 * c);
    M.add(i, i + 1, 22 * L * c);
    M.add(i, i + 2, 54 * c);
    M.add(i, i + 3, -13 * L * c);
    M.add(i + 1, i + 1, 4 * L * L * c);
    M.add(i + 1, i + 2, 13 * L * c);
    M.add(i + 1, i + 3, -3 * L * L * c);
    M.add(i + 2, i + 2, 156 * c);
    M.add(i + 2, i + 3, -22 * L * c);
    M.add(i + 3, i + 3, 4 * L * L * c);
  }
  for (const p of pointMasses) M.add(2 * p.node, 2 * p.node, p.mass);
  return M;
}

/** Transverse nodal force of the unconstrained stiffness, (K·u) at node i's deflection unknown. */
export function nodalForce(mesh: Mesh, u: Float64Array, node: number): number {
  let f = 0;
  for (let e = node - 1; e <= node; e++) {
    if (e < 0 || e >= mesh.EI.length) continue;
    const L = mesh.x[e + 1] - mesh.x[e];
    const c = mesh.EI[e] / L ** 3;
    const j = 2 * e;
    const v1 = u[j];
    const t1 = u[j + 1];
    const v2 = u[j + 2];
    const t2 = u[j + 3];
    f +=
      e === node
        ? c * (12 * v1 + 6 * L * t1 - 12 * v2 + 6 * L * t2)
        : c * (-12 * v1 - 6 * L * t1 + 12 * v2 - 6 * L * t2);
  }
  return f;
}

/** Deflection and slope at x inside element e from its Hermite shape functions, written to out[0], out[1]. */
export function hermiteInto(mesh: Mesh, u: Float64Array, e: number, x: number, out: Float64Array): void {
  const x0 = mesh.x[e];
  const L = mesh.x[e + 1] - x0;
  const s = (x - x0) / L;
  const s2 = s * s;
  const s3 = s2 * s;
  const j = 2 * e;
  out[0] =
    (1 - 3 * s2 + 2 * s3) * u[j] +
    L * (s - 2 * s2 + s3) * u[j + 1] +
    (3 * s2 - 2 * s3) * u[j + 2] +
    L * (s3 - s2) * u[j + 3];
  out[1] = ((6 * s2 - 6 * s) * (u[j] - u[j + 2])) / L + (1 - 4 * s + 3 * s2) * u[j + 1] + (3 * s2 - 2 * s) * u[j + 3];
}

/** Deflection and slope at x inside element e, as a pair. */
export function hermite(mesh: Mesh, u: Float64Array, e: number, x: number): [number, number] {
  const out = new Float64Array(2);
  hermiteInto(mesh, u, e, x, out);
  return [out[0], out[1]];
}

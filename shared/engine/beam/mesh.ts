import type { Model } from '../model';
import { STATION_TOLERANCE } from '../shaft-geometry';

/*
 * Nodes of the beam model: every segment joint, support, load, mass and feature station, plus
 * evenly spaced nodes so no element is longer than 1/MIN_ELEMENTS of the shaft nor 1/SPAN_ELEMENTS
 * of the span between two supports (the consistent mass matrix then gives the first natural frequency within about 1e-5
 * of exact; statics is exact anyway).
 */
export const MIN_ELEMENTS = 10;
/** Elements per span at least (a line shaft's spans each need their own resolution for the critical speed). */
export const SPAN_ELEMENTS = 8;

export interface Mesh {
  x: Float64Array;
  /** Whether a node is a named station (not a subdivision): those carry the bending diagram. */
  isKey: Uint8Array;
  /** Per element: E·I (N·mm²), mass per length (t/mm) and segment index. */
  EI: Float64Array;
  rhoA: Float64Array;
  seg: Int32Array;
}

/** Largest element length: 1/MIN_ELEMENTS of the shaft, and 1/SPAN_ELEMENTS of a span between two supports. */
function stepAt(x: number, supports: readonly number[], total: number): number {
  const step = total / MIN_ELEMENTS;
  const right = supports.findIndex((s) => s > x);
  if (right <= 0) return step; // an overhang (or no supports): the shaft-wide step
  return Math.min(step, (supports[right] - supports[right - 1]) / SPAN_ELEMENTS);
}

export function buildMesh(
  model: Model,
  supports: readonly number[],
  stations: number[],
  densities: readonly number[],
): Mesh {
  const tol = STATION_TOLERANCE * model.total;
  const all = [...model.bounds, ...supports, ...stations].sort((a, b) => a - b);
  const keys: number[] = [];
  for (const x of all) if (!keys.length || x - keys[keys.length - 1] > tol) keys.push(x);
  const sorted = [...supports].sort((a, b) => a - b);
  const xs: number[] = [];
  const isKey: number[] = [];
  for (let i = 0; i < keys.length - 1; i++) {
    const step = stepAt((keys[i] + keys[i + 1]) / 2, sorted, model.total);
    const pieces = Math.max(1, Math.ceil((keys[i + 1] - keys[i]) / step - 1e-9));
    for (let j = 0; j < pieces; j++) {
      xs.push(keys[i] + ((keys[i + 1] - keys[i]) * j) / pieces);
      isKey.push(j === 0 ? 1 : 0);
    }
  }
  xs.push(keys[keys.length - 1]);
  isKey.push(1);
  const ne = xs.length - 1;
  const mesh: Mesh = {
    x: Float64Array.from(xs),
    isKey: Uint8Array.from(isKey),
    EI: new Float64Array(ne),
    rhoA: new Float64Array(ne),
    seg: new Int32Array(ne),
  };
  let s = 0;
  for (let e = 0; e < ne; e++) {
    const mid = (xs[e] + xs[e + 1]) / 2;
    while (s < model.segs.length - 1 && mid > model.segs[s].end) s++;
    const g = model.segs[s];
    mesh.EI[e] = (g.mat.E * Math.PI * (g.od ** 4 - g.id ** 4)) / 64;
    mesh.rhoA[e] = (densities[s] * Math.PI * (g.od ** 2 - g.id ** 2)) / 4;
    mesh.seg[e] = s;
  }
  return mesh;
}

/** Index of the node at station x (the nearest; stations given to buildMesh are nodes). */
export function nodeAt(mesh: Mesh, x: number): number {
  let lo = 0;
  let hi = mesh.x.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (mesh.x[mid] <= x) lo = mid;
    else hi = mid;
  }
  return Math.abs(mesh.x[lo] - x) <= Math.abs(mesh.x[hi] - x) ? lo : hi;
}

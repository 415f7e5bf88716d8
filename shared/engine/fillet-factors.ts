/*
 * Stress-concentration fits for a shoulder fillet on a stepped round shaft.
 * Peterson torsion polynomial: Pilkey & Pilkey, Peterson's Stress Concentration Factors, 3rd ed.
 * Norton power-law fits Kt = A·(r/d)^b: Norton, Machine Design: An Integrated Approach, 2nd ed., App. E.
 */
type FitRow = readonly [Dd: number, A: number, b: number];

export const NORTON_BENDING: readonly FitRow[] = [
  [1.01, 0.91938, -0.17032],
  [1.02, 0.96048, -0.17711],
  [1.03, 0.98061, -0.18381],
  [1.05, 0.98137, -0.19653],
  [1.07, 0.97527, -0.20958],
  [1.1, 0.9512, -0.23757],
  [1.2, 0.97098, -0.21796],
  [1.5, 0.93836, -0.25759],
  [2, 0.90879, -0.28598],
  [3, 0.89334, -0.3086],
  [6, 0.87868, -0.33243],
];

export const NORTON_TORSION: readonly FitRow[] = [
  [1.09, 0.90337, -0.12692],
  [1.2, 0.83425, -0.21649],
  [1.33, 0.84897, -0.23161],
  [2, 0.86331, -0.23865],
];

/** r/d span of Norton's App. E charts, over which the power-law fits were made (from memory). */
export const NORTON_RD_RANGE: readonly [number, number] = [0.01, 0.3];

export function nortonRdInRange(rd: number): boolean {
  return rd >= NORTON_RD_RANGE[0] && rd <= NORTON_RD_RANGE[1];
}

export const PETERSON_TR_MIN = 0.25;
export const PETERSON_TR_MAX = 4;

export interface FitValue {
  value: number;
  /** True when D/d lay outside the tabulated rows and the nearest row was used. */
  isClamped: boolean;
}

/** Norton fit, rows (ascending D/d) interpolated linearly in D/d; beyond them the nearest row, flagged. */
export function nortonFit(rows: readonly FitRow[], Dd: number, rd: number): FitValue {
  const first = rows[0];
  const last = rows[rows.length - 1];
  if (Dd <= first[0]) return { value: first[1] * rd ** first[2], isClamped: Dd < first[0] };
  if (Dd >= last[0]) return { value: last[1] * rd ** last[2], isClamped: Dd > last[0] };
  let i = 1;
  while (rows[i][0] < Dd) i++;
  const [d0, a0, b0] = rows[i - 1];
  const [d1, a1, b1] = rows[i];
  const k0 = a0 * rd ** b0;
  const k1 = a1 * rd ** b1;
  return { value: k0 + ((k1 - k0) * (Dd - d0)) / (d1 - d0), isClamped: false };
}

/** Peterson polynomial for Kts; t = (D − d)/2. Valid for 0.25 ≤ t/r ≤ 4 only: check with petersonInRange. */
export function petersonTorsion(D: number, d: number, r: number): number {
  const t = (D - d) / 2;
  const tr = t / r;
  const s = Math.sqrt(tr);
  const c1 = 0.905 + 0.783 * s - 0.075 * tr;
  const c2 = -0.437 - 1.969 * s + 0.553 * tr;
  const c3 = 1.557 + 1.073 * s - 0.578 * tr;
  const c4 = -1.061 + 0.171 * s + 0.086 * tr;
  const x = (2 * t) / D;
  return c1 + x * (c2 + x * (c3 + x * c4));
}

export function petersonInRange(tOverR: number): boolean {
  return tOverR >= PETERSON_TR_MIN && tOverR <= PETERSON_TR_MAX;
}

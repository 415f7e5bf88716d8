import { MM_PER_IN, MPA_PER_KSI } from './units';

export type Loading = 'bending' | 'torsion';

/**
 * Shigley's q charts stop at r = 4 mm; for larger radii the 4 mm ordinate is used (Shigley 9th, Fig. 6-20 note, from
 * memory).
 */
export const NOTCH_RADIUS_CAP_MM = 4;

/**
 * Range in which the Eq. 6-35 cubics stay positive; Shigley quotes 50–250 kpsi bending, 50–220 torsion (from memory).
 */
export const NEUBER_SUT_RANGE_KPSI: Record<Loading, readonly [number, number]> = {
  bending: [50, 250],
  torsion: [50, 220],
};

export const NEUBER_METHOD =
  'Neuber q = 1/(1 + √a/√r), √a by Shigley 9th Eq. 6-35 (Sut in kpsi, √a in √in), r capped at 4 mm';

/** Neuber constant √a in √in (Shigley 9th Eq. 6-35); Sut in kpsi, clamped to the range of the fit. */
export function neuberSqrtA(sutKpsi: number, loading: Loading): number {
  const [lo, hi] = NEUBER_SUT_RANGE_KPSI[loading];
  const s = Math.min(Math.max(sutKpsi, lo), hi);
  const c0 = loading === 'bending' ? 0.246 : 0.19;
  const c1 = loading === 'bending' ? -3.08e-3 : -2.51e-3;
  const c2 = loading === 'bending' ? 1.51e-5 : 1.35e-5;
  return c0 + s * (c1 + s * (c2 - 2.67e-8 * s));
}

/** True when Sut (MPa) lies in the range of Eq. 6-35; outside it the nearest end is used (conservative). */
export function neuberInRange(sutMpa: number, loading: Loading): boolean {
  const kpsi = sutMpa / MPA_PER_KSI;
  const [lo, hi] = NEUBER_SUT_RANGE_KPSI[loading];
  return kpsi >= lo && kpsi <= hi;
}

/** Notch sensitivity q (Shigley Eq. 6-33) for Sut in MPa and notch radius in mm. */
export function notchSensitivity(sutMpa: number, radiusMm: number, loading: Loading): number {
  const sqrtA = neuberSqrtA(sutMpa / MPA_PER_KSI, loading);
  const sqrtR = Math.sqrt(Math.min(radiusMm, NOTCH_RADIUS_CAP_MM) / MM_PER_IN);
  return 1 / (1 + sqrtA / sqrtR);
}

/** Fatigue stress-concentration factor Kf = 1 + q·(Kt − 1) (Shigley Eq. 6-32). */
export function fatigueFactor(Kt: number, q: number): number {
  return 1 + q * (Kt - 1);
}

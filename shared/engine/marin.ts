/*
 * Marin factors and the unmodified endurance limit (Budynas & Nisbett, Shigley's Mechanical
 * Engineering Design, 9th ed., §6-7 to §6-9). Strengths in MPa, diameters in mm.
 */
import { MPA_PER_KSI } from './units';

export type Surface = 'ground' | 'machined' | 'cold-drawn' | 'hot-rolled' | 'as-forged';
export type SurfaceTable = '9th-10th' | '11th';

type Coefficients = Record<Surface, readonly [a: number, b: number]>;

/** Table 6-2, MPa coefficients. The 11th-edition row is from memory (unverified): a warning says so. */
export const SURFACE_COEFFICIENTS: Record<SurfaceTable, Coefficients> = {
  '9th-10th': {
    ground: [1.58, -0.085],
    machined: [4.51, -0.265],
    'cold-drawn': [4.51, -0.265],
    'hot-rolled': [57.7, -0.718],
    'as-forged': [272, -0.995],
  },
  '11th': {
    ground: [1.38, -0.067],
    machined: [3.04, -0.217],
    'cold-drawn': [3.04, -0.217],
    'hot-rolled': [38.6, -0.65],
    'as-forged': [54.9, -0.758],
  },
};

/** Table 6-5 reliability factors ke, keyed by reliability in %. */
export const RELIABILITY_FACTORS: Readonly<Record<number, number>> = {
  50: 1,
  90: 0.897,
  95: 0.868,
  99: 0.814,
  99.9: 0.753,
  99.99: 0.702,
};

export const SIZE_RANGE_MM: readonly [number, number] = [2.79, 254];
/** Eq. 6-27 was fitted over 70–1000 °F (from memory). */
export const TEMPERATURE_RANGE_F: readonly [number, number] = [70, 1000];
/**
 * Temperatures that need no warning, in each system's unit: Table 6-4 starts at room temperature,
 * 20 °C (68 °F), where kd = 1 (from memory), and the polynomial's 70 °F end gives kd = 1.000 too.
 */
export const TEMPERATURE_NO_WARNING = { SI: [20, 537.8], US: [68, 1000] } as const;

/** Surface factor ka = a·Sut^b (Eq. 6-19, Table 6-2), Sut in MPa. */
export function surfaceFactor(surface: Surface, sutMpa: number, table: SurfaceTable = '9th-10th'): number {
  const [a, b] = SURFACE_COEFFICIENTS[table][surface];
  return a * sutMpa ** b;
}

/** kb for rotating round bars in bending or torsion, mm form of Eq. 6-20. */
export function sizeFactor(dMm: number): number {
  return dMm <= 51 ? 1.24 * dMm ** -0.107 : 1.51 * dMm ** -0.157;
}

/** Inch form of Eq. 6-20 (0.11–10 in); kept to check the mm form against the printed inch values. */
export function sizeFactorInch(dIn: number): number {
  return dIn <= 2 ? 0.879 * dIn ** -0.107 : 0.91 * dIn ** -0.157;
}

/** kd by the Eq. 6-27 polynomial in °F (from memory); outside 70–1000 °F the nearest end is used. */
export function temperatureFactor(tempC: number): number {
  const tf = Math.min(Math.max(tempC * 1.8 + 32, TEMPERATURE_RANGE_F[0]), TEMPERATURE_RANGE_F[1]);
  return 0.975 + tf * (0.432e-3 + tf * (-0.115e-5 + tf * (0.104e-8 - 0.595e-12 * tf)));
}

/**
 * Eq. 6-8 (steels) as printed in each unit system: Se′ = 0.5·Sut up to 1400 MPa, 700 MPa above; or
 * 0.5·Sut up to 200 kpsi, 100 kpsi above. The two caps differ by 1.5 % (100 kpsi = 689.5 MPa), so a
 * US calc takes the kpsi form rather than a converted 700 MPa (issue 9, item 1).
 */
export const SE_PRIME_CAP_MPA = { SI: 700, US: 100 * MPA_PER_KSI } as const;

export function unmodifiedEndurance(sutMpa: number, capMpa: number = SE_PRIME_CAP_MPA.SI): number {
  return Math.min(0.5 * sutMpa, capMpa);
}

import { MM_PER_IN, N_PER_LBF, type UnitSystem } from '../units';

/*
 * Units of the beam model. Internally: N, mm, N·mm, MPa and, so that N = t·mm/s², mass in tonnes
 * and density in t/mm³. Conversions: 1 lb = 0.45359237 kg exactly (international pound).
 */
export const KG_PER_LB = 0.45359237;

export interface BeamFactors {
  force: number;
  rating: number;
  mass: number;
  density: number;
}

/** Multiply a value in the system's display unit by this to get the internal base unit. */
export const BEAM_BASE: Record<UnitSystem, BeamFactors> = {
  SI: { force: 1, rating: 1000, mass: 1e-3, density: 1e-12 },
  US: { force: N_PER_LBF, rating: N_PER_LBF, mass: KG_PER_LB * 1e-3, density: (KG_PER_LB * 1e-3) / MM_PER_IN ** 3 },
};

export const BEAM_LABELS: Record<UnitSystem, { force: string; rating: string; mass: string; density: string }> = {
  SI: { force: 'N', rating: 'kN', mass: 'kg', density: 'kg/m³' },
  US: { force: 'lbf', rating: 'lbf', mass: 'lb', density: 'lb/in³' },
};

/** Default density of steel in the system's unit when the author enters none. */
export const STEEL_DENSITY: Record<UnitSystem, number> = { SI: 7850, US: 0.283 };

import { RELIABILITY_FACTORS, SE_PRIME_CAP_MPA, temperatureFactor, type Surface, type SurfaceTable } from './marin';
import type { CalcInput } from './schema';
import { toBase, type FactorTable } from './units';

/* The calc's fatigue block in base units, with the Marin factors it leaves out filled in. */
export interface FatigueSettings {
  surface: Surface;
  table: SurfaceTable;
  kc: number;
  kd: number;
  ke: number;
  kf: number;
  isKfOnMidrange: boolean;
  taFraction: number;
  SePrime: number | null;
  /** Cap of Se′ = 0.5·Sut in MPa: Eq. 6-8 in the calc's own unit system. */
  sePrimeCap: number;
}

/** The fatigue settings of validated input, or null when the calc asks for no fatigue check. */
export function fatigueSettings(input: CalcInput, k: FactorTable): FatigueSettings | null {
  const f = input.fatigue;
  if (!f) return null;
  const kd =
    f.kd ?? (f.temperature === undefined ? 1 : temperatureFactor(toBase(f.temperature, 'temperature', input.units)));
  return {
    surface: f.surface,
    table: f.surfaceTable ?? '9th-10th',
    kc: f.kc ?? 1,
    kd,
    kf: f.kf ?? 1,
    ke: RELIABILITY_FACTORS[f.reliability ?? 50],
    isKfOnMidrange: f.kfOnMidrange ?? true,
    taFraction: f.alternatingTorqueFraction ?? 0,
    SePrime: f.SePrime === undefined ? null : f.SePrime * k.stress,
    sePrimeCap: SE_PRIME_CAP_MPA[input.units],
  };
}

import type { FatigueSettings } from './fatigue-settings';
import type { Mat } from './model';
import type { Endurance } from './result';
import { sizeFactor, surfaceFactor, unmodifiedEndurance } from './marin';

export const ENDURANCE_METHOD =
  'Se = ka·kb·kc·kd·ke·kf·Se′ (Shigley 9th Eq. 6-18); Se′ = 0.5·Sut ≤ 700 MPa (SI) or ≤ 100 kpsi (US) ' +
  '(Eq. 6-8) unless entered; ka Table 6-2 (MPa coefficients); kb Eq. 6-20 mm form on the outer diameter; ke Table 6-5';

/**
 * Marin-modified endurance limit (MPa) at outer diameter dMm. kb takes the mm form of Eq. 6-20 in
 * both unit systems so SI and US calcs of one shaft agree (the inch form differs by < 0.3 %).
 */
export function enduranceLimit(mat: Mat, dMm: number, f: FatigueSettings): Endurance {
  const SePrime = f.SePrime ?? unmodifiedEndurance(mat.Su, f.sePrimeCap);
  const ka = surfaceFactor(f.surface, mat.Su, f.table);
  const kb = sizeFactor(dMm);
  const Se = SePrime * ka * kb * f.kc * f.kd * f.ke * f.kf;
  return { SePrime, ka, kb, kc: f.kc, kd: f.kd, ke: f.ke, kf: f.kf, Se };
}

export function enduranceOut(e: Endurance, stressPerUnit: number): Endurance {
  return { ...e, SePrime: e.SePrime / stressPerUnit, Se: e.Se / stressPerUnit };
}

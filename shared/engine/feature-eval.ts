import { momentAt } from './bending-diagram';
import { safetyFactor, trescaShear, vonMises } from './combined';
import { enduranceOut } from './endurance';
import { featureGeometry, type FeatureGeometry } from './feature-geometry';
import { stressFactors } from './feature-factors';
import { fatigueSafety } from './fatigue-criteria';
import { keyCheck } from './key-check';
import type { Model } from './model';
import { fatigueFactor, NEUBER_METHOD, notchSensitivity } from './notch-sensitivity';
import type { Endurance, FeatureResult, KeyCheck, StressSet } from './result';
import type { FeatureInput } from './schema';
import { STATION_TOLERANCE } from './shaft-geometry';
import { torqueAt, type Piece } from './torque-diagram';

const scaled = (s: StressSet, k: number): StressSet =>
  ({ sigmaA: s.sigmaA / k, sigmaM: s.sigmaM / k, tauA: s.tauA / k, tauM: s.tauM / k });

function ratios(ft: FeatureInput, g: FeatureGeometry) {
  const isFillet = ft.type === 'shoulder-fillet' && g.D !== null;
  return {
    rOverD: g.r / g.d,
    DOverd: isFillet ? g.D! / g.d : null,
    tOverR: isFillet ? (g.D! - g.d) / 2 / g.r : null,
  };
}

function keyFor(ft: FeatureInput, Tpeak: number, g: FeatureGeometry, model: Model): KeyCheck | null {
  if (ft.type !== 'keyseat') return null;
  const { length: L, stress: S } = model.k;
  const dims = { width: ft.width && ft.width * L, height: ft.height && ft.height * L, length: ft.length && ft.length * L, Sy: ft.Sy && ft.Sy * S };
  const c = keyCheck(Tpeak, g.d, dims);
  if (!c) return null;
  const conv = (v: number | null): number | null => (v === null ? null : v / S);
  return { ...c, shearStress: conv(c.shearStress), bearingStress: conv(c.bearingStress) };
}

/**
 * Factors, stresses and safety at one feature (results in the calc's units). Stresses use the
 * moments and torques at the station (the larger side where torque jumps); Kf and Kfs multiply
 * the nominal stresses, on the midrange too unless the fatigue settings say otherwise.
 */
export function evaluateFeature(model: Model, index: number, pieces: readonly Piece[],
  endurance: readonly (Endurance | null)[]): FeatureResult {
  const ft = (model.input.features ?? [])[index];
  const path = `features[${index}]`;
  const k = model.k;
  const g = featureGeometry(model, ft);
  const x = ft.at * k.length;
  const fac = stressFactors(ft, g, path, model.warnings);
  const q = notchSensitivity(g.seg.mat.Su, g.r, 'bending');
  const qs = notchSensitivity(g.seg.mat.Su, g.r, 'torsion');
  const Kf = fatigueFactor(fac.Kt, q);
  const Kfs = fatigueFactor(fac.Kts, qs);
  const { Ma, Mm } = momentAt(model.moments, x);
  const { T, Ta } = torqueAt(pieces, x, STATION_TOLERANCE * model.total);
  const nominal: StressSet = { sigmaA: Ma / g.Z, sigmaM: Mm / g.Z, tauA: Ta / g.Zp, tauM: Math.abs(T) / g.Zp };
  const km = model.fatigue?.isKfOnMidrange === false ? [1, 1] : [Kf, Kfs];
  const peak: StressSet = { sigmaA: Kf * nominal.sigmaA, sigmaM: km[0] * nominal.sigmaM, tauA: Kfs * nominal.tauA, tauM: km[1] * nominal.tauM };
  const sigma = peak.sigmaA + peak.sigmaM;
  const tau = peak.tauA + peak.tauM;
  const vm = vonMises(sigma, tau);
  const tresca = trescaShear(sigma, tau);
  const se = endurance[g.seg.index];
  const mat = g.seg.mat;
  return {
    index, type: ft.type, ...(ft.label ? { label: ft.label } : {}), at: ft.at, segment: g.seg.index,
    D: g.D === null ? null : g.D / k.length, d: g.d / k.length, di: g.di / k.length, r: g.r / k.length, ...ratios(ft, g),
    Kt: fac.Kt, Kts: fac.Kts, q, qs, Kf, Kfs, method: { Kt: fac.ktMethod, Kts: fac.ktsMethod, notch: NEUBER_METHOD },
    Ma: Ma / k.torque, Mm: Mm / k.torque, Ta: Ta / k.torque, Tm: Math.abs(T) / k.torque,
    nominal: scaled(nominal, k.stress), peak: scaled(peak, k.stress),
    sigmaVonMises: vm / k.stress, tauTresca: tresca / k.stress,
    yieldSafety: safetyFactor(mat.Sy, vm), yieldSafetyTresca: safetyFactor(mat.Sy, 2 * tresca),
    endurance: se ? enduranceOut(se, k.stress) : null,
    fatigueSafety: se ? fatigueSafety(vonMises(peak.sigmaA, peak.tauA), vonMises(peak.sigmaM, peak.tauM), se.Se, mat.Su, mat.Sy) : null,
    key: keyFor(ft, Math.abs(T) + Ta, g, model),
  };
}

import { bendingAt } from './beam/bending-at';
import { safetyFactor, trescaShear, vonMises } from './combined';
import { enduranceOut } from './endurance';
import { featureGeometry, type FeatureGeometry } from './feature-geometry';
import { stressFactors, type Factors } from './feature-factors';
import { fatigueSafety } from './fatigue-criteria';
import { keyCheck } from './key-check';
import type { Model } from './model';
import { fatigueFactor, NEUBER_METHOD, notchSensitivity } from './notch-sensitivity';
import type { Endurance, FeatureResult, KeyCheck, StressSet } from './result';
import type { FeatureInput } from './schema';
import { STATION_TOLERANCE } from './shaft-geometry';
import { torqueAt, type Piece } from './torque-diagram';

/** Internal (N·mm, MPa) state of one feature before conversion to the calc's units. */
interface FeatureState {
  ft: FeatureInput;
  g: FeatureGeometry;
  fac: Factors;
  q: number;
  qs: number;
  Kf: number;
  Kfs: number;
  Ma: number;
  Mm: number;
  M: number;
  T: number;
  Ta: number;
  nominal: StressSet;
  peak: StressSet;
}

function stressSet(sigmaA: number, sigmaM: number, tauA: number, tauM: number): StressSet {
  return { sigmaA, sigmaM, tauA, tauM };
}

function scaled(s: StressSet, k: number): StressSet {
  return stressSet(s.sigmaA / k, s.sigmaM / k, s.tauA / k, s.tauM / k);
}

function orNull(v: number | null, k: number): number | null {
  return v === null ? null : v / k;
}

/**
 * Factors and stresses at one feature. Loads are those at the station (the larger side where the
 * torque jumps); Kf and Kfs multiply the nominal stresses, on the midrange too unless the fatigue
 * settings say otherwise (Shigley 9th §7-4 applies them to both, the conservative default).
 */
function featureState(model: Model, index: number, pieces: readonly Piece[]): FeatureState {
  const ft = (model.input.features ?? [])[index];
  const g = featureGeometry(model, ft);
  const fac = stressFactors(ft, g, `features[${index}]`, model.warnings, model.input.methods?.filletKts ?? 'peterson');
  const q = notchSensitivity(g.seg.mat.Su, g.r, 'bending');
  const qs = notchSensitivity(g.seg.mat.Su, g.r, 'torsion');
  const Kf = fatigueFactor(fac.Kt, q);
  const Kfs = fatigueFactor(fac.Kts, qs);
  const x = ft.at * model.k.length;
  const { Ma, Mm, M } = bendingAt(model, x);
  const { T, Ta } = torqueAt(pieces, x, STATION_TOLERANCE * model.total);
  const nominal = stressSet(Ma / g.Z, Mm / g.Z, Ta / g.Zp, Math.abs(T) / g.Zp);
  const onMid = model.fatigue?.isKfOnMidrange !== false;
  const peak = stressSet(
    Kf * nominal.sigmaA,
    (onMid ? Kf : 1) * nominal.sigmaM,
    Kfs * nominal.tauA,
    (onMid ? Kfs : 1) * nominal.tauM,
  );
  return { ft, g, fac, q, qs, Kf, Kfs, Ma, Mm, M, T, Ta, nominal, peak };
}

function keyFor(s: FeatureState, model: Model): KeyCheck | null {
  if (s.ft.type !== 'keyseat') return null;
  const { length: L, stress: S } = model.k;
  const ft = s.ft;
  const c = keyCheck(Math.abs(s.T) + s.Ta, s.g.d, {
    width: ft.width && ft.width * L,
    height: ft.height && ft.height * L,
    length: ft.length && ft.length * L,
    Sy: ft.Sy && ft.Sy * S,
  });
  return c && { ...c, shearStress: orNull(c.shearStress, S), bearingStress: orNull(c.bearingStress, S) };
}

/** One feature's result in the calc's units; `endurance` holds each segment's Se in MPa (or null). */
export function evaluateFeature(
  model: Model,
  index: number,
  pieces: readonly Piece[],
  endurance: readonly (Endurance | null)[],
): FeatureResult {
  const s = featureState(model, index, pieces);
  const { ft, g, peak } = s;
  const k = model.k;
  const sigma = peak.sigmaA + peak.sigmaM;
  const tau = peak.tauA + peak.tauM;
  const [vm, tresca, se, mat] = [vonMises(sigma, tau), trescaShear(sigma, tau), endurance[g.seg.index], g.seg.mat];
  const isFillet = g.D !== null;
  return {
    index,
    type: ft.type,
    label: ft.label,
    at: ft.at,
    segment: g.seg.index,
    D: isFillet ? g.D! / k.length : null,
    d: g.d / k.length,
    di: g.di / k.length,
    r: g.r / k.length,
    rOverD: g.r / g.d,
    DOverd: isFillet ? g.D! / g.d : null,
    tOverR: isFillet ? (g.D! - g.d) / 2 / g.r : null,
    Kt: s.fac.Kt,
    Kts: s.fac.Kts,
    q: s.q,
    qs: s.qs,
    Kf: s.Kf,
    Kfs: s.Kfs,
    method: { Kt: s.fac.ktMethod, Kts: s.fac.ktsMethod, notch: NEUBER_METHOD },
    M: s.M / k.torque,
    Ma: s.Ma / k.torque,
    Mm: s.Mm / k.torque,
    Ta: s.Ta / k.torque,
    Tm: Math.abs(s.T) / k.torque,
    nominal: scaled(s.nominal, k.stress),
    peak: scaled(peak, k.stress),
    sigmaVonMises: vm / k.stress,
    tauTresca: tresca / k.stress,
    yieldSafety: safetyFactor(mat.Sy, vm),
    yieldSafetyTresca: safetyFactor(mat.Sy, 2 * tresca),
    endurance: se ? enduranceOut(se, k.stress) : null,
    fatigueSafety: se
      ? fatigueSafety(vonMises(peak.sigmaA, peak.tauA), vonMises(peak.sigmaM, peak.tauM), se.Se, mat.Su, mat.Sy)
      : null,
    key: keyFor(s, model),
  };
}

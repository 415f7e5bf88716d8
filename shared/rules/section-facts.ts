import type { CalcInput, CalcResult, FeatureResult, SafetyByCriterion, SegmentResult } from '../engine';
import type { FactQuantity } from './fact-registry';
import type { Facts, ToSI } from './facts';
import { preparedFor } from './prepared-rule-set';
import type { FatigueCriterion, RuleSet } from './rule-set-schema';

/* Facts of each cross-section the engine reports on (segments and features), in SI. */

export const CRITERION_KEY: Readonly<Record<FatigueCriterion, keyof SafetyByCriterion>> = {
  'DE-Goodman': 'goodman',
  'DE-ASME-elliptic': 'asmeElliptic',
  'DE-Gerber': 'gerber',
  'DE-Soderberg': 'soderberg',
};

function materialKindOf(input: CalcInput, segment: number): string {
  return input.segments[segment]?.material?.kind ?? input.material.kind ?? 'steel';
}

/*
 * Allowable shear stress of the old ASME Code for Design of Transmission Shafting: the lesser of
 * asmeSyFraction·Sy and asmeSuFraction·Su, times asmeKeywayFactor where a keyseat is present
 * (0.30, 0.18, 0.75 in the published rule, sourced via Schaum's Outline of Machine Design). Left out
 * when a parameter is missing, so a clause that uses it reports "Undefined fact" instead of passing.
 */
function allowableShear(ruleSet: RuleSet, Sy: number, Su: number, hasKeyseat: boolean): number | undefined {
  const p = preparedFor(ruleSet).asme;
  return p === null ? undefined : Math.min(p[0] * Sy, p[1] * Su) * (hasKeyseat ? p[2] : 1);
}

export function segmentFacts(s: SegmentResult, input: CalcInput, ruleSet: RuleSet, si: ToSI): Facts {
  const key = CRITERION_KEY[ruleSet.methods.fatigueCriterion];
  const [od, Sy, Su] = [si(s.od, 'length'), si(s.Sy, 'stress'), si(s.Su, 'stress')];
  const twistPerLength = si(s.twistPerLength, 'twistPerLength');
  const facts: Facts = {
    index: s.index,
    materialKind: materialKindOf(input, s.index),
    od,
    id: si(s.id, 'length'),
    length: si(s.length, 'length'),
    boreRatio: s.id / s.od,
    isHollow: s.isHollow,
    hasKeyseat: s.hasKeyseat,
    isLoaded: s.yieldSafety !== null,
    Sy,
    Su,
    G: si(s.G, 'modulus'),
    torque: si(Math.abs(s.T), 'torque'),
    tauMax: si(s.tauMax, 'stress'),
    twist: Math.abs(s.twist),
    twistPerLength,
    twistPerDiameter: (twistPerLength * od) / 1000,
    sigmaVonMises: si(s.sigmaVonMises, 'stress'),
    yieldSafety: s.yieldSafety,
    yieldSafetyTresca: s.yieldSafetyTresca,
    Se: s.endurance ? si(s.endurance.Se, 'stress') : null,
    fatigueSafety: s.fatigueSafety ? s.fatigueSafety[key] : null,
    fatigueSafetyBy: s.fatigueSafety,
  };
  const allowable = allowableShear(ruleSet, Sy, Su, s.hasKeyseat);
  if (allowable !== undefined) facts.allowableShear = allowable;
  return facts;
}

function nullableSI(v: number | null | undefined, q: FactQuantity, si: ToSI): number | null {
  return v === null || v === undefined ? null : si(v, q);
}

export function featureFacts(
  f: FeatureResult,
  input: CalcInput,
  result: CalcResult,
  ruleSet: RuleSet,
  si: ToSI,
): Facts {
  const ft = (input.features ?? [])[f.index];
  const seg = input.segments[f.segment];
  return {
    index: f.index,
    segment: f.segment,
    type: f.type,
    form: ft?.type === 'keyseat' ? ft.form : null,
    materialKind: materialKindOf(input, f.segment),
    isLoaded: f.yieldSafety !== null,
    at: si(f.at, 'length'),
    d: si(f.d, 'length'),
    D: nullableSI(f.D, 'length', si),
    r: si(f.r, 'length'),
    rOverD: f.rOverD,
    DOverd: f.DOverd,
    tOverR: f.tOverR,
    Kt: f.Kt,
    Kts: f.Kts,
    isKtEntered: ft?.Kt !== undefined,
    isKtsEntered: ft?.Kts !== undefined,
    q: f.q,
    qs: f.qs,
    Kf: f.Kf,
    Kfs: f.Kfs,
    Sy: si(seg.material?.Sy ?? input.material.Sy, 'stress'),
    Su: si(seg.material?.Su ?? input.material.Su, 'stress'),
    sigmaVonMises: si(f.sigmaVonMises, 'stress'),
    yieldSafety: f.yieldSafety,
    Se: f.endurance ? si(f.endurance.Se, 'stress') : null,
    fatigueSafety: f.fatigueSafety ? f.fatigueSafety[CRITERION_KEY[ruleSet.methods.fatigueCriterion]] : null,
    fatigueSafetyBy: f.fatigueSafety,
    hasKey: f.key !== null,
    keyShearStress: nullableSI(f.key?.shearStress, 'stress', si),
    keyBearingStress: nullableSI(f.key?.bearingStress, 'stress', si),
    keyShearSafety: f.key?.shearSafety ?? null,
    keyBearingSafety: f.key?.bearingSafety ?? null,
    M: si(f.M, 'torque'),
    isBendingFromModel: result.supports.length >= 2,
  };
}

import { toSI, type CalcInput, type CalcResult } from '../engine';
import { loadFacts, shaftBeamFacts, supportFacts } from './beam-facts';
import { PLAIN_QUANTITIES, type FactQuantity } from './fact-registry';
import type { RuleSet } from './rule-set-schema';
import { CRITERION_KEY, featureFacts, segmentFacts } from './section-facts';

export type Facts = Record<string, unknown>;

export interface LocationFacts {
  shaft: Facts;
  segments: Facts[];
  features: Facts[];
  supports: Facts[];
  loads: Facts[];
}

export type ToSI = (value: number, quantity: FactQuantity) => number;

function converter(units: CalcInput['units']): ToSI {
  if (units === 'SI') return (v) => v;
  return (v, q) =>
    PLAIN_QUANTITIES.has(q) ? v : toSI(v, q as 'length' | 'torque' | 'stress' | 'modulus' | 'twistPerLength', 'US');
}

function shaftFacts(input: CalcInput, result: CalcResult, ruleSet: RuleSet, si: ToSI): Facts {
  const fatigue = result.minFatigueSafety?.[CRITERION_KEY[ruleSet.methods.fatigueCriterion]];
  return {
    materialKind: input.material.kind ?? 'steel',
    unitSystem: input.units,
    segmentCount: result.segments.length,
    featureCount: result.features.length,
    hasFatigue: input.fatigue !== undefined,
    hasBending: (input.bending ?? []).length > 0,
    hasKeyseat: result.segments.some((s) => s.hasKeyseat),
    engineWarningCount: result.warnings.length,
    length: si(result.length, 'length'),
    twistTotal: Math.abs(result.twistTotal),
    tauMax: si(result.maxShear.value, 'stress'),
    minYieldSafety: result.minYieldSafety?.value ?? null,
    minFatigueSafety: fatigue?.value ?? null,
    ...shaftBeamFacts(result, si),
  };
}

/** Facts of every location of a calc, in SI, for the rule set's method choices. */
export function locationFacts(input: CalcInput, result: CalcResult, ruleSet: RuleSet): LocationFacts {
  const si = converter(input.units);
  return {
    shaft: shaftFacts(input, result, ruleSet, si),
    segments: result.segments.map((s) => segmentFacts(s, input, ruleSet, si)),
    features: result.features.map((f) => featureFacts(f, input, result, ruleSet, si)),
    supports: result.supports.map((s) => supportFacts(s, ruleSet, si)),
    loads: result.loads.map((l) => loadFacts(l, si)),
  };
}

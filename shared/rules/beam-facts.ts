import type { CalcResult, LoadResult, SupportResult } from '../engine';
import { SLOPE_PARAMS } from './beam-facts-registry';
import type { Facts, ToSI } from './facts';
import type { RuleSet } from './rule-set-schema';

/* Facts of the beam model (bearings, loads and the whole-shaft figures), in SI. */
export function supportFacts(s: SupportResult, ruleSet: RuleSet, si: ToSI): Facts {
  const limit = ruleSet.parameters.find((p) => p.name === SLOPE_PARAMS[s.kind])?.value;
  const facts: Facts = {
    index: s.index,
    kind: s.kind,
    at: si(s.at, 'length'),
    isLocating: s.locating,
    hasRating: s.C !== null,
    slope: s.slope,
    L10: s.L10,
    L10h: s.L10h,
  };
  // Left out when the parameter is missing, so a clause using it reports "Undefined fact" instead of passing.
  if (typeof limit === 'number') facts.allowableSlope = limit;
  return facts;
}

export function loadFacts(l: LoadResult, si: ToSI): Facts {
  return {
    index: l.index,
    kind: l.kind,
    at: si(l.at, 'length'),
    isGear: l.kind === 'gear',
    deflection: si(l.deflection, 'length'),
    slope: l.slope,
  };
}

export function shaftBeamFacts(result: CalcResult, si: ToSI): Facts {
  const c = result.criticalSpeed;
  return {
    hasSupports: result.supports.length >= 2,
    maxDeflection: result.deflection ? si(result.deflection.max, 'length') : null,
    criticalSpeed: c ? c.rpm : null,
    operatingSpeed: result.speed,
    criticalSpeedRatio: c?.ratio ?? null,
  };
}

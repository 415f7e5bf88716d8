import type { UnitSystem } from '../engine';
import { ASME_PARAMS, factSpec, quantityUnit, type FactQuantity } from './fact-registry';
import { PARAM_PREFIX } from './condition-schema';
import type { Facts } from './facts';
import { RuleSetCache } from './rule-set-cache';
import type { Clause, RuleSet } from './rule-set-schema';

/*
 * What every evaluation of a rule set needs besides the conditions, worked out once per rule set:
 * clause references, measure labels and units, parameters as facts, the old ASME rule's fractions.
 * Checklists are evaluated on every keystroke and by the thousand in impact analysis.
 */
export interface PreparedMeasure {
  actual: string;
  limit: string;
  isAtMost: boolean;
  label: string;
  quantity: FactQuantity;
  unit: Readonly<Record<UnitSystem, string>>;
}

export interface PreparedClause {
  clause: Clause;
  reference: string;
  measure: PreparedMeasure | null;
}

export interface PreparedRuleSet {
  clauses: PreparedClause[];
  params: Facts;
  /** asmeSyFraction, asmeSuFraction, asmeKeywayFactor; null when one is missing or not a number. */
  asme: readonly [number, number, number] | null;
}

function prepareMeasure(ruleSet: RuleSet, clause: Clause): PreparedMeasure | null {
  const m = clause.measure;
  if (!m) return null;
  const spec = factSpec(clause.scope, m.actual);
  const quantity = spec?.quantity ?? '1';
  const unitIn = (s: UnitSystem): string => quantityUnit(quantity, s);
  return {
    actual: m.actual,
    limit: m.limit,
    isAtMost: m.sense === 'at-most',
    quantity,
    unit: { SI: unitIn('SI'), US: unitIn('US') },
    label: (spec?.label ?? m.actual).replace('rule-set criterion', ruleSet.methods.fatigueCriterion),
  };
}

/** Rule-set parameters as facts named "param:<name>" (the same for both evaluators). */
function parameterFacts(ruleSet: RuleSet): Facts {
  const out: Facts = {};
  for (const p of ruleSet.parameters) out[PARAM_PREFIX + p.name] = p.value;
  return out;
}

function asmeFractions(ruleSet: RuleSet): PreparedRuleSet['asme'] {
  const v = ASME_PARAMS.map((name) => ruleSet.parameters.find((p) => p.name === name)?.value);
  return v.every((x): x is number => typeof x === 'number') ? [v[0], v[1], v[2]] : null;
}

const PREPARED = new RuleSetCache((ruleSet): PreparedRuleSet => ({
  clauses: ruleSet.clauses.map((clause) => ({
    clause,
    reference: `${ruleSet.code} v${ruleSet.version} §${clause.id}`,
    measure: prepareMeasure(ruleSet, clause),
  })),
  params: parameterFacts(ruleSet),
  asme: asmeFractions(ruleSet),
}));

export function preparedFor(ruleSet: RuleSet): PreparedRuleSet {
  return PREPARED.get(ruleSet);
}

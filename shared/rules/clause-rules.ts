import {
  Engine,
  Operator,
  Rule,
  type EngineResult,
  type RuleProperties,
  type TopLevelCondition,
} from 'json-rules-engine';
import type { TopCondition } from './condition-schema';
import type { Facts } from './facts';
import { TOLERANT_OPERATORS } from './limit-tolerance';

/* json-rules-engine rules and engines as the runner (engine-runner.ts) builds them from clauses. */
const EVENT = { type: 'clause-evaluated' };

/** One rule named `name` over a clause's applicability or check conditions. */
export function clauseRule(name: string, conditions: TopCondition): Rule {
  // A deep copy: the engine keeps and annotates the condition objects it is given.
  const props: RuleProperties = {
    name,
    conditions: JSON.parse(JSON.stringify(conditions)) as TopLevelCondition,
    event: EVENT,
  };
  return new Rule(props);
}

// json-rules-engine's own check on the fact of an ordering operator: parseFloat must give a number.
const isNumberLike = (v: unknown): boolean => Number.parseFloat(v as string).toString() !== 'NaN';

/**
 * Replaces the engine's four ordering operators by the ones that compare at a limit with the
 * project's tolerance (limit-tolerance.ts), so both evaluators decide a value at its limit alike.
 */
export function useLimitOperators(engine: Engine): Engine {
  for (const [name, cb] of Object.entries(TOLERANT_OPERATORS)) engine.addOperator(new Operator(name, cb, isNumberLike));
  return engine;
}

/** An engine over `rules` with the rule set's parameters as facts; undefined facts are errors. */
export function newEngine(params: Facts, rules: Rule[]): Engine {
  const engine = useLimitOperators(new Engine(rules, { allowUndefinedFacts: false }));
  for (const [name, value] of Object.entries(params)) engine.addFact(name, value);
  return engine;
}

/** Whether each rule that ran matched, by rule name. */
export function resultsByName(r: EngineResult): Map<string, boolean> {
  const out = new Map<string, boolean>();
  for (const x of r.results) out.set(x.name, true);
  for (const x of r.failureResults) out.set(x.name, false);
  return out;
}

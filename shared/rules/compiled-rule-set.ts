import { errorText, failed, notApplicable, type ClauseOutcome } from './clause-outcome';
import type { Facts } from './facts';
import { preparedFor } from './prepared-rule-set';
import { RuleSetCache } from './rule-set-cache';
import type { RuleSet } from './rule-set-schema';
import { compileCondition, type Compiled } from './sync-evaluator';

type CompiledClause = { applies: Compiled; check: Compiled } | { broken: string };

export interface CompiledRuleSet {
  clauses: CompiledClause[];
  params: Facts;
}

function compileClause(clause: RuleSet['clauses'][number]): CompiledClause {
  try {
    return { applies: compileCondition(clause.applicability), check: compileCondition(clause.check) };
  } catch (err) {
    return { broken: errorText(err) };
  }
}

const COMPILED = new RuleSetCache((ruleSet): CompiledRuleSet => ({
  clauses: ruleSet.clauses.map(compileClause),
  params: preparedFor(ruleSet).params,
}));

/** The cached synchronous form of a rule set (compiled once per code + version and content). */
export function compiledFor(ruleSet: RuleSet): CompiledRuleSet {
  return COMPILED.get(ruleSet);
}

/** One clause at one location, synchronously; the check runs only where the clause applies. */
export function outcomeSync(compiled: CompiledRuleSet, index: number, facts: Facts): ClauseOutcome {
  const clause = compiled.clauses[index];
  if ('broken' in clause) return failed(clause.broken, null);
  let applies: boolean;
  try {
    applies = clause.applies(facts, compiled.params);
  } catch (err) {
    return failed(err, null);
  }
  if (!applies) return notApplicable();
  try {
    return { applies, passes: clause.check(facts, compiled.params), error: null };
  } catch (err) {
    return failed(err, true);
  }
}

import type { CalcInput, CalcResult } from '../engine';
import { assemble, targetsByScope, type Outcomes } from './checklist';
import type { Checklist, ManualState } from './checklist-types';
import { runnerFor } from './engine-runner';
import { SCOPES, type RuleSet } from './rule-set-schema';

/*
 * The reference evaluation of a checklist, through json-rules-engine. No product code runs it: the
 * server and the browser use the compiled evaluator (evaluateChecklistSync). It stays out of
 * shared/rules/index.ts so that json-rules-engine is loaded only by the tests and the bench that compare
 * the two, not by the server or the browser's bundle.
 */
export { useLimitOperators } from './clause-rules';

/**
 * evaluateChecklistSync's checklist computed through json-rules-engine, the reference the compiled
 * evaluator is held equal to (test/shared/rules/equivalence.spec.ts and others). The Engine is built once per
 * rule set (code + version and content) and reused.
 */
export async function evaluateChecklist(
  input: CalcInput,
  result: CalcResult,
  ruleSet: RuleSet,
  manual?: Record<string, ManualState>,
): Promise<Checklist> {
  const targets = targetsByScope(input, result, ruleSet);
  const runner = runnerFor(ruleSet);
  const outcomes: Outcomes = ruleSet.clauses.map(() => []);
  for (const scope of SCOPES) {
    for (const t of targets[scope]) {
      for (const [i, outcome] of await runner.evaluate(scope, t.facts)) outcomes[i].push(outcome);
    }
  }
  return assemble(input, result, ruleSet, targets, outcomes, manual);
}

import { CalcInputError, evaluateValidInput, validateCalcInput } from '../../../../../shared/engine';
import type { CalcInput, CalcIssue, CalcResult } from '../../../../../shared/engine';
import { applyRuleSetMethods, type RuleSet } from '../../../../../shared/rules';
import { shaftOutline, type ShaftOutline } from '../../../../../shared/plots';

/*
 * The part of the live calc that validates and evaluates: the shared input schema, engine and rule set. The editor
 * loads it on its own (live-calc.ts) so its first view does not wait for the schema library to be run.
 */
// The compiled checklist evaluator: synchronous, and the one the server stores a save's checklist with
// (json-rules-engine is the reference both are held equal to in test/shared/rules/equivalence.spec.ts).
export { evaluateChecklistSync } from '../../../../../shared/rules';

export interface Evaluated {
  input: CalcInput;
  result: CalcResult;
  outline: ShaftOutline;
}

export type Attempt = { evaluated: Evaluated } | { issues: CalcIssue[] };

// The rule set fixes some methods (Table 6-2 edition, Kf on midrange stresses): evaluate what the checker will see.
export function attempt(input: unknown, ruleSet: RuleSet | null): Attempt {
  const checked = validateCalcInput(input);
  if (!checked.ok) return { issues: checked.issues };
  try {
    const applied = ruleSet ? applyRuleSetMethods(checked.value, ruleSet) : checked.value;
    return { evaluated: { input: applied, result: evaluateValidInput(applied), outline: shaftOutline(applied) } };
  } catch (error) {
    if (error instanceof CalcInputError) return { issues: error.issues };
    return { issues: [{ path: '(input)', message: `the engine could not evaluate this input: ${String(error)}` }] };
  }
}

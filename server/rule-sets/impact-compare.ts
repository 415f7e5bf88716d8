import { evaluateValidInput, validateCalcInput, type CalcInput } from '../../shared/engine';
import { applyRuleSetMethods, evaluateChecklistSync, type RuleSet } from '../../shared/rules';
import { outcomeOf, type OutcomeSummary } from '../../shared/schemas/outcome';

/**
 * The outcome of a stored input under another version of its standard, as impact analysis and the
 * review-health signals judge it. An approved revision's input passed validation when it was signed
 * (signing needs a result), so the schema check is not repeated here; it is the costliest step per revision.
 * The synchronous evaluator gives the same rows as json-rules-engine (tested in shared/rules) at bulk speed.
 */
export function outcomeUnder(raw: unknown, doc: RuleSet): OutcomeSummary {
  try {
    const input = applyRuleSetMethods(raw as CalcInput, doc);
    return outcomeOf(evaluateChecklistSync(input, evaluateValidInput(input), doc));
  } catch {
    // Only input a newer engine no longer accepts gets here: validate it to say so.
    return { verdict: validateCalcInput(raw).ok ? 'error' : 'invalid-input', failing: [] };
  }
}

/** The outcome a revision was stored with (older rows kept only the verdict). */
export function storedOutcome(outcome: string | null, verdict: string | null): OutcomeSummary {
  return outcome ? JSON.parse(outcome) : { verdict, failing: [] };
}

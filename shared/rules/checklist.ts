import { CAUTION, type CalcInput, type CalcResult } from '../engine';
import type { ClauseOutcome } from './clause-outcome';
import { buildRow } from './checklist-row';
import type { Checklist, ChecklistRow, ManualState } from './checklist-types';
import { compiledFor, outcomeSync } from './compiled-rule-set';
import { runnerFor } from './engine-runner';
import { locationFacts, parameterFacts } from './facts';
import { targetsOf, type Target } from './locations';
import { manualRows, summarize } from './verdict';
import { methodsUsed } from './rule-set-methods';
import { SCOPES, type RuleSet } from './rule-set-schema';

/** Outcomes per clause index, then per location (the order of targetsOf). */
type Outcomes = Map<number, ClauseOutcome[]>;

function targetsByScope(input: CalcInput, result: CalcResult, ruleSet: RuleSet): Map<string, Target[]> {
  const facts = locationFacts(input, result, ruleSet);
  return new Map(SCOPES.map((s) => [s, targetsOf(s, input, result, facts)]));
}

function assemble(input: CalcInput, result: CalcResult, ruleSet: RuleSet, targets: Map<string, Target[]>,
  outcomes: Outcomes, manual: Record<string, ManualState> | undefined): Checklist {
  const params = parameterFacts(ruleSet);
  const rows: ChecklistRow[] = [];
  ruleSet.clauses.forEach((clause, i) => {
    const list = outcomes.get(i) ?? [];
    targets.get(clause.scope)!.forEach((t, k) => rows.push(buildRow(ruleSet, clause, t, list[k], params, input.units)));
  });
  const { used, issues } = methodsUsed(input, result, ruleSet);
  const { manual: manualList, notes } = manualRows(ruleSet, manual);
  const { code, title, version, status, effectiveDate } = ruleSet;
  return {
    ruleSet: { code, title, version, status, effectiveDate }, engineVersion: result.engineVersion, units: input.units,
    methods: used, methodIssues: issues, rows, manual: manualList, manualOpen: manualList.filter((m) => !m.done).length,
    ...summarize(rows, issues), notes, caution: CAUTION,
  };
}

/**
 * The checklist of a calc against a rule set, through json-rules-engine: one row per clause and
 * location (shaft, each segment, each feature), the manual items with their state, and the verdict.
 * `input` must be the calc as evaluated, i.e. after applyRuleSetMethods; a method that differs from
 * the rule set's choice is reported in methodIssues and blocks "compliant". A clause that throws
 * gives "error" rows with the reason, never a pass. The json-rules-engine Engine is built once per
 * rule set (code + version and content) and reused.
 */
export async function evaluateChecklist(input: CalcInput, result: CalcResult, ruleSet: RuleSet,
  manual?: Record<string, ManualState>): Promise<Checklist> {
  const targets = targetsByScope(input, result, ruleSet);
  const runner = runnerFor(ruleSet);
  const outcomes: Outcomes = new Map(ruleSet.clauses.map((_, i) => [i, []]));
  for (const scope of SCOPES) {
    for (const t of targets.get(scope)!) {
      for (const [i, outcome] of await runner.evaluate(scope, t.facts)) outcomes.get(i)!.push(outcome);
    }
  }
  return assemble(input, result, ruleSet, targets, outcomes, manual);
}

/**
 * The same checklist as evaluateChecklist, computed synchronously by the compiled evaluator
 * (sync-evaluator.ts) for bulk work: impact analysis, minimum diameters, live editing. Tests hold
 * the two to identical output.
 */
export function evaluateChecklistSync(input: CalcInput, result: CalcResult, ruleSet: RuleSet,
  manual?: Record<string, ManualState>): Checklist {
  const targets = targetsByScope(input, result, ruleSet);
  const compiled = compiledFor(ruleSet);
  const outcomes: Outcomes = new Map();
  ruleSet.clauses.forEach((clause, i) => {
    outcomes.set(i, targets.get(clause.scope)!.map((t) => outcomeSync(compiled, i, t.facts)));
  });
  return assemble(input, result, ruleSet, targets, outcomes, manual);
}

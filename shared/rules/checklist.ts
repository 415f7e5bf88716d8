import { CAUTION, placeOf, type CalcInput, type CalcResult } from '../engine';
import type { ClauseOutcome } from './clause-outcome';
import { buildRow } from './checklist-row';
import type { Checklist, ChecklistRow, ManualState } from './checklist-types';
import { compiledFor, outcomeSync } from './compiled-rule-set';
import { locationFacts } from './facts';
import { targetsOf, type Target } from './locations';
import { manualRows, summarize } from './verdict';
import { methodsUsed } from './rule-set-methods';
import { preparedFor } from './prepared-rule-set';
import type { RuleSet, Scope } from './rule-set-schema';

/** Outcomes per clause index, then per location (the order of targetsOf). */
export type Outcomes = ClauseOutcome[][];
export type Targets = Record<Scope, Target[]>;

/** Every location a clause of each scope is checked at, with its facts. */
export function targetsByScope(input: CalcInput, result: CalcResult, ruleSet: RuleSet): Targets {
  // A result of another calc would give facts of the wrong shaft: refuse it rather than guess.
  const nf = (input.features ?? []).length;
  if (
    result.segments.length !== input.segments.length ||
    result.features.length !== nf ||
    result.units !== input.units
  ) {
    throw new Error(
      `checklist: the result (${result.segments.length} segments, ${result.features.length} features, ${result.units}) ` +
        `is not of this input (${input.segments.length} segments, ${nf} features, ${input.units}); evaluate the input first`,
    );
  }
  const facts = locationFacts(input, result, ruleSet);
  const of = (scope: Scope): Target[] => targetsOf(scope, input, result, facts);
  return {
    shaft: of('shaft'),
    segment: of('segment'),
    feature: of('feature'),
    support: of('support'),
    load: of('load'),
  };
}

// An engine warning about a segment or feature (a fit used outside its range, say) belongs on
// every row at that location as well as in the result's list, so a checker sees it beside the verdict.
function engineWarnings(result: CalcResult, loc: ChecklistRow['location'], featureTypes: readonly string[]): string[] {
  if (loc.index === null || loc.scope === 'shaft') return [];
  const prefix = `${loc.scope}s[${loc.index}]`;
  return result.warnings
    .filter((w) => w.path === prefix || w.path.startsWith(`${prefix}.`))
    .map((w) => `${placeOf(w.path, featureTypes)}: ${w.message}`);
}

/** The checklist from each clause's outcome at each location (as either evaluator gives them). */
export function assemble(
  input: CalcInput,
  result: CalcResult,
  ruleSet: RuleSet,
  targets: Targets,
  outcomes: Outcomes,
  manual: Record<string, ManualState> | undefined,
): Checklist {
  const { clauses, params } = preparedFor(ruleSet);
  const rows: ChecklistRow[] = [];
  const featureTypes = (input.features ?? []).map((f) => f.type);
  clauses.forEach((p, i) => {
    const list = outcomes[i];
    targets[p.clause.scope].forEach((t, k) => {
      const row = buildRow(p, t, list[k], params, input.units);
      if (row.status !== 'not-applicable') row.warnings.push(...engineWarnings(result, row.location, featureTypes));
      rows.push(row);
    });
  });
  const { used, issues } = methodsUsed(input, result, ruleSet);
  const { manual: manualList, notes } = manualRows(ruleSet, manual);
  const { code, title, version, status, effectiveDate } = ruleSet;
  return {
    ruleSet: { code, title, version, status, effectiveDate },
    engineVersion: result.engineVersion,
    units: input.units,
    methods: used,
    methodIssues: issues,
    rows,
    manual: manualList,
    manualOpen: manualList.filter((m) => !m.done).length,
    ...summarize(rows, issues),
    notes,
    caution: CAUTION,
  };
}

/**
 * The checklist of a calc against a rule set: one row per clause and location (shaft, each segment, each
 * feature, support and load), the manual items with their state, and the verdict. `input` must be the calc
 * as evaluated, i.e. after applyRuleSetMethods; a method that differs from the rule set's choice is reported
 * in methodIssues and blocks "compliant". A clause that throws gives "error" rows with the reason, never a
 * pass. Computed synchronously by the compiled evaluator (sync-evaluator.ts): what the server stores on every
 * save, the editor's live checklist, and bulk work (impact analysis, minimum diameters). The same checklist
 * through json-rules-engine (reference-checklist.ts) is the reference: tests hold the two to identical output
 * on every shipped standard and whole shaft, and on generated conditions and calcs.
 */
export function evaluateChecklistSync(
  input: CalcInput,
  result: CalcResult,
  ruleSet: RuleSet,
  manual?: Record<string, ManualState>,
): Checklist {
  const targets = targetsByScope(input, result, ruleSet);
  const compiled = compiledFor(ruleSet);
  const outcomes: Outcomes = ruleSet.clauses.map((clause, i) =>
    targets[clause.scope].map((t) => outcomeSync(compiled, i, t.facts)),
  );
  return assemble(input, result, ruleSet, targets, outcomes, manual);
}

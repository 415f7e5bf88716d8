import { computed, linkedSignal, type Signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { catchError, from, map, of, switchMap } from 'rxjs';
import {
  CalcInputError,
  evaluateValidInput,
  validateCalcInput,
  type CalcInput,
  type CalcIssue,
  type CalcResult,
} from '../../../../../shared/engine';
import { applyRuleSetMethods, evaluateChecklist, type Checklist, type RuleSet } from '../../../../../shared/rules';
import { shaftOutline, type ShaftOutline } from '../../../../../shared/plots';

export interface Evaluated {
  input: CalcInput;
  result: CalcResult;
  outline: ShaftOutline;
}
export type ChecklistState =
  | { kind: 'none' }
  | { kind: 'ready'; checklist: Checklist; ruleSet: RuleSet; result: CalcResult }
  | { kind: 'failed'; message: string };

type Attempt = { evaluated: Evaluated } | { issues: CalcIssue[] };

// The rule set fixes some methods (Table 6-2 edition, Kf on midrange stresses): evaluate what the checker will see.
function attempt(input: unknown, ruleSet: RuleSet | null): Attempt {
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

/**
 * Live results in the browser from the shared engine and rule set. While the input has issues the last
 * good result stays on screen, marked stale, so typing a half number does not blank the page.
 */
export function liveCalc(input: Signal<Record<string, unknown>>, ruleSet: Signal<RuleSet | null>) {
  const latest = computed(() => attempt(input(), ruleSet()));
  const issues = computed(() => {
    const a = latest();
    return 'issues' in a ? a.issues : [];
  });
  const evaluated = linkedSignal<Attempt, Evaluated | null>({
    source: latest,
    computation: (a, previous) => ('evaluated' in a ? a.evaluated : (previous?.value ?? null)),
  });
  const isStale = computed(() => issues().length > 0 && evaluated() !== null);
  const job = computed(() => ({ ev: evaluated(), rs: ruleSet() }));
  // The checklist is asynchronous (json-rules-engine): switchMap drops an answer overtaken by newer input.
  const checklist = toSignal(
    toObservable(job).pipe(
      switchMap(({ ev, rs }) =>
        !ev || !rs
          ? of<ChecklistState>({ kind: 'none' })
          : from(evaluateChecklist(ev.input, ev.result, rs)).pipe(
              map((c): ChecklistState => ({ kind: 'ready', checklist: c, ruleSet: rs, result: ev.result })),
              catchError((e: unknown) =>
                of<ChecklistState>({ kind: 'failed', message: `The checklist could not be evaluated: ${String(e)}` }),
              ),
            ),
      ),
    ),
    { initialValue: { kind: 'none' } as ChecklistState },
  );
  return { issues, evaluated, isStale, checklist };
}

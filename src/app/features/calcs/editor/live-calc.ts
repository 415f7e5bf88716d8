import { computed, linkedSignal, signal, type Signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { catchError, from, map, of, switchMap } from 'rxjs';
import type { Checklist, RuleSet } from '../../../../../shared/rules';
import type { CalcResult } from '../../../../../shared/engine';
import type { Attempt, Evaluated } from './live-engine';

export type { Evaluated } from './live-engine';
export type ChecklistState =
  | { kind: 'none' }
  | { kind: 'ready'; checklist: Checklist; ruleSet: RuleSet; result: CalcResult }
  | { kind: 'failed'; message: string };

type LiveEngine = typeof import('./live-engine');
let loading: Promise<LiveEngine> | undefined;
/** The validating engine, fetched once, beside the editor's first reads rather than before its first view. */
export const loadLiveEngine = (): Promise<LiveEngine> => (loading ??= import('./live-engine'));

/**
 * Live results in the browser from the shared engine and rule set. While the input has issues the last
 * good result stays on screen, marked stale, so typing a half number does not blank the page.
 */
export function liveCalc(input: Signal<Record<string, unknown>>, ruleSet: Signal<RuleSet | null>) {
  // Until the engine is there, nothing is judged: no issues, no live result (the stored checklist stays shown).
  const engine = signal<LiveEngine | null>(null);
  void loadLiveEngine().then((e) => engine.set(e));
  const latest = computed((): Attempt | null => engine()?.attempt(input(), ruleSet()) ?? null);
  const issues = computed(() => {
    const a = latest();
    return a && 'issues' in a ? a.issues : [];
  });
  const evaluated = linkedSignal<Attempt | null, Evaluated | null>({
    source: latest,
    computation: (a, previous) => (a && 'evaluated' in a ? a.evaluated : (previous?.value ?? null)),
  });
  const isStale = computed(() => issues().length > 0 && evaluated() !== null);
  const job = computed(() => ({ ev: evaluated(), rs: ruleSet(), e: engine() }));
  // The checklist is asynchronous (json-rules-engine): switchMap drops an answer overtaken by newer input.
  const checklist = toSignal(
    toObservable(job).pipe(
      switchMap(({ ev, rs, e }) =>
        !ev || !rs || !e
          ? of<ChecklistState>({ kind: 'none' })
          : from(e.evaluateChecklist(ev.input, ev.result, rs)).pipe(
              map((c): ChecklistState => ({ kind: 'ready', checklist: c, ruleSet: rs, result: ev.result })),
              catchError((err: unknown) =>
                of<ChecklistState>({ kind: 'failed', message: `The checklist could not be evaluated: ${String(err)}` }),
              ),
            ),
      ),
    ),
    { initialValue: { kind: 'none' } as ChecklistState },
  );
  return { issues, evaluated, isStale, checklist };
}

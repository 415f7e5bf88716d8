import type { Signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { debounceTime, identity, map, startWith, switchMap } from 'rxjs';
import type { EditorForm, EditorValue } from './editor-form';

/**
 * The form's value as a signal, re-subscribed whenever the form is replaced as a whole (load, unit change) and
 * quiet for `debounceMs` after the last keystroke, so the engine runs once per pause in typing. Call it in an
 * injection context.
 */
export function debouncedValue(
  form: Signal<EditorForm>,
  debounceMs: number,
  initialValue: EditorValue = form().getRawValue(),
): Signal<EditorValue> {
  return toSignal(
    toObservable(form).pipe(
      // A new form (load, restore, unit change) counts at once: waiting out the typing pause would first show the
      // results and red fields of the value it replaced, then build them all again for its own.
      switchMap((f) =>
        f.valueChanges.pipe(
          map(() => f.getRawValue()),
          debounceMs > 0 ? debounceTime(debounceMs) : identity,
          startWith(f.getRawValue()),
        ),
      ),
    ),
    { initialValue },
  );
}

import { Injectable, InjectionToken } from '@angular/core';
import type { AbstractControl } from '@angular/forms';
import type { ErrorStateMatcher } from '@angular/material/core';

/** Quiet time after the last keystroke before the engine runs; specs set 0 to run synchronously. */
export const EDITOR_DEBOUNCE_MS = new InjectionToken<number>('EDITOR_DEBOUNCE_MS', { factory: () => 150 });

/**
 * Engine issues are shown as soon as they exist, not only after the field was touched: a restored
 * draft or a change elsewhere (a segment removed) can make an untouched field wrong.
 */
@Injectable()
export class EngineErrorState implements ErrorStateMatcher {
  isErrorState(control: AbstractControl | null): boolean {
    return !!control && control.invalid;
  }
}

/** Canonical text of a calc input, to tell "changed" from "same" (valueToInput fixes the key order). */
export function canonical(input: Record<string, unknown>): string {
  return JSON.stringify(input);
}

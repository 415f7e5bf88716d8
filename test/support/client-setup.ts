import { setupZonelessTestEnv } from 'jest-preset-angular/setup-env/zoneless';
import { TestBed } from '@angular/core/testing';
import { InteractivityChecker } from '@angular/cdk/a11y';

setupZonelessTestEnv();

// jsdom lays nothing out, so nothing is ever in view: `@defer (on viewport)` waits for its other triggers.
class NeverInView {
  observe(): void {}
  unobserve(): void {}
  disconnect(): void {}
  takeRecords(): [] {
    return [];
  }
}
globalThis.IntersectionObserver ??= NeverInView as unknown as typeof IntersectionObserver;

// A dialog's focus trap warns "Element matching '[cdkFocusInitial]' is not focusable" when the element fails CDK's
// visibility check, which reads layout (offsetWidth, getClientRects): jsdom lays nothing out, so every element fails
// it, and the editor specs' "Save and leave" button (enabled, in an open dialog) warned. Only that warning is dropped,
// and only for an element CDK itself finds focusable once visibility is left out: a disabled button or a plain wrapper
// still warns, as it would in a browser. Every other warning passes through.
const FOCUS_INITIAL_WARNING = "Element matching '[cdkFocusInitial]' is not focusable.";
const warn = console.warn.bind(console);
console.warn = (...args: unknown[]) => {
  const [message, element] = args;
  if (message === FOCUS_INITIAL_WARNING && element instanceof HTMLElement && focusableApartFromLayout(element)) return;
  warn(...args);
};

function focusableApartFromLayout(element: HTMLElement): boolean {
  try {
    return TestBed.inject(InteractivityChecker).isFocusable(element, { ignoreVisibility: true });
  } catch {
    return false; // no test module to ask: let the warning through
  }
}

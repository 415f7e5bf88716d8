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

// Component styles (ours and Material's, added to <head> by Angular as each component first renders) are parsed by
// jsdom's CSS parser in every spec file, and jsdom lays nothing out, so no spec can see what they do: about a tenth of
// the client project's CPU (DEVELOPERS.md, "Tests"). A <style> element whose type is not text/css is not applied (HTML,
// "update a style block"), so every one the page creates starts with another type. Code that wants a style sheet sets
// its own type, as CDK's breakpoint observer sets text/css, and gets one. A spec that needs real CSS belongs in the
// browser specs (test/e2e), which run the built app in Chromium.
const createElement = Document.prototype.createElement;
Document.prototype.createElement = function (this: Document, name: string, options?: ElementCreationOptions) {
  const element = createElement.call(this, name, options);
  if (name.toLowerCase() === 'style') element.setAttribute('type', 'text/x-unapplied-in-jsdom');
  return element;
} as typeof Document.prototype.createElement;

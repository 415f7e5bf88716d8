import {
  DOCUMENT,
  DestroyRef,
  Injectable,
  InjectionToken,
  Injector,
  afterNextRender,
  inject,
  signal,
} from '@angular/core';

/** `idle`: the deferred panels are built one per idle moment after the first render; `hold`: only when shown. */
export const PANEL_PACING = new InjectionToken<'idle' | 'hold'>('PANEL_PACING', { factory: () => 'idle' });

/** How many panels of the workbench are built later than the first render (see calc-workbench.html). */
export const DEFERRED_PANELS = 9;

const idle = (fn: () => void): (() => void) => {
  if (typeof requestIdleCallback !== 'function') {
    const t = setTimeout(fn);
    return () => clearTimeout(t);
  }
  const id = requestIdleCallback(fn, { timeout: 400 });
  return () => cancelIdleCallback(id);
};

/*
 * The workbench builds its title, verdict and segments at once and the panels below them later: each one when it
 * scrolls near the viewport or, failing that, one per idle moment of the browser, so the first screen is usable
 * while the rest is built in short steps the author can type between. Only the page is deferred: the form holds
 * every field from the start, so the live calc, validation and save are always complete.
 */
@Injectable()
export class PanelPacer {
  private readonly injector = inject(Injector);
  private readonly document = inject(DOCUMENT);
  private readonly count = signal(0);
  private cancel: (() => void) | null = null;
  private isDestroyed = false;

  constructor() {
    if (inject(PANEL_PACING) === 'idle') afterNextRender(() => this.next());
    inject(DestroyRef).onDestroy(() => {
      this.isDestroyed = true;
      this.cancel?.();
    });
  }

  /** Whether the n-th deferred panel (counted from 1, in page order) may be built now. */
  reached(n: number): boolean {
    return this.count() >= n;
  }

  /** Builds every deferred panel now; resolves with the element `selector` names once it is there (or null). */
  async reveal(selector?: string): Promise<HTMLElement | null> {
    this.count.set(DEFERRED_PANELS);
    for (let waited = 0; waited < 5000; waited += 40) {
      const found = selector ? this.document.querySelector<HTMLElement>(selector) : null;
      if (found || !selector) return found;
      await new Promise((resolve) => setTimeout(resolve, 40));
    }
    return null;
  }

  private next(): void {
    if (this.isDestroyed || this.count() >= DEFERRED_PANELS) return;
    this.cancel = idle(() => {
      this.count.update((c) => Math.min(DEFERRED_PANELS, c + 1));
      afterNextRender(() => this.next(), { injector: this.injector });
    });
  }
}

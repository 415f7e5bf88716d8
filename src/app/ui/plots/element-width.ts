import { DestroyRef, ElementRef, inject, signal, type Signal } from '@angular/core';

/**
 * The host element's width in CSS pixels, kept current with a ResizeObserver. Plots are laid out in
 * real pixels so that tick labels keep their size instead of scaling with a viewBox.
 */
export function hostWidth(fallback: number): Signal<number> {
  const host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;
  const width = signal(fallback);
  // jsdom (component tests) and very old browsers have no ResizeObserver: keep the fallback width.
  if (typeof ResizeObserver === 'undefined') return width.asReadonly();
  const observer = new ResizeObserver(([entry]) => {
    const w = Math.floor(entry?.contentRect.width ?? 0);
    if (w > 0) width.set(Math.max(320, w));
  });
  observer.observe(host);
  inject(DestroyRef).onDestroy(() => observer.disconnect());
  return width.asReadonly();
}

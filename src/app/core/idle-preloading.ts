import { ApplicationRef, Injectable, inject } from '@angular/core';
import type { PreloadingStrategy, Route } from '@angular/router';
import { Observable, firstValueFrom, from } from 'rxjs';

const idle = () =>
  new Promise<void>((resolve) =>
    typeof requestIdleCallback === 'function' ? requestIdleCallback(() => resolve()) : setTimeout(resolve),
  );

/**
 * Loads the other screens' scripts ahead of need, so moving on from the first screen does not wait for them: only
 * once the first screen has settled (no read or task pending), then one screen at a time, each in an idle moment of
 * the browser, so the preloading never competes with the screen being used.
 */
@Injectable({ providedIn: 'root' })
export class IdlePreloading implements PreloadingStrategy {
  private readonly appRef = inject(ApplicationRef);
  private turn: Promise<unknown> | null = null;

  preload(_route: Route, load: () => Observable<unknown>): Observable<unknown> {
    const mine = (this.turn ?? this.appRef.whenStable())
      .then(idle)
      .then(() => firstValueFrom(load(), { defaultValue: undefined }));
    // The next screen's turn comes after this one has loaded, failed or not.
    this.turn = mine.catch(() => undefined);
    return from(mine);
  }
}

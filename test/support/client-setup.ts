import { setupZonelessTestEnv } from 'jest-preset-angular/setup-env/zoneless';

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

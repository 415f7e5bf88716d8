import { TestBed, type ComponentFixture } from '@angular/core/testing';
import type { EnvironmentProviders, Provider, Type } from '@angular/core';
import { provideHttpClient, withInterceptors, type HttpRequest } from '@angular/common/http';
import { errorInterceptor } from '../../src/app/core/http/error-interceptor';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';

/**
 * One component spec's set-up: the component on a TestBed with the real HttpClient talking to
 * HttpTestingController through the app's error interceptor (so failures arrive as the app's one error shape),
 * its inputs set, and harness loaders. Specs read the DOM and harnesses and
 * answer requests by URL, so they hold whichever way a component's service fetches its data. A component
 * that reads through a resource has its request open after mounting: answer it before using a harness
 * (harnesses wait for stability, which an open resource request holds off).
 */
export async function mountComponent<T>(
  type: Type<T>,
  options: { inputs?: Record<string, unknown>; providers?: (Provider | EnvironmentProviders)[] } = {},
) {
  TestBed.configureTestingModule({
    providers: [
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      ...(options.providers ?? []),
    ],
  });
  const fixture: ComponentFixture<T> = TestBed.createComponent(type);
  for (const [name, value] of Object.entries(options.inputs ?? {})) fixture.componentRef.setInput(name, value);
  const http = TestBed.inject(HttpTestingController);
  const mounted = {
    fixture,
    http,
    loader: TestbedHarnessEnvironment.loader(fixture),
    /** Overlays (selects, menus, dialogs) render outside the component. */
    rootLoader: TestbedHarnessEnvironment.documentRootLoader(fixture),
    element: fixture.nativeElement as HTMLElement,
    text: () => (fixture.nativeElement as HTMLElement).textContent?.replace(/\s+/g, ' ').trim() ?? '',
    // Array.from, not spread: the server's tsconfig (which also checks test/) has no iterable DOM lib.
    alerts: () =>
      Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('[role="alert"]')).map((a) =>
        a.textContent?.trim(),
      ),
    /**
     * Lets answered requests' promises run (one macrotask turn, no delay), then runs effects and renders.
     * It does not wait for stability: a resource's open request holds that off until the spec answers it.
     */
    async settle(): Promise<void> {
      await new Promise((resolve) => setTimeout(resolve));
      TestBed.tick();
      fixture.detectChanges();
    },
    /**
     * Settles until the component has sent a request `matches` picks, and returns it: a condition, not a time. Run it
     * beside a harness action that sends one (the harness waits for stability, which the open request holds off).
     */
    async request(matches: (r: HttpRequest<unknown>) => boolean): Promise<TestRequest> {
      for (;;) {
        await mounted.settle();
        const found = http.match(matches);
        if (found.length) return found[0];
      }
    },
    /** Runs a harness action that sends a request, answers that request with `body`, and returns it once both end. */
    async answerDuring(
      action: () => Promise<unknown>,
      matches: (r: HttpRequest<unknown>) => boolean,
      body: object,
    ): Promise<HttpRequest<unknown>> {
      const acting = action();
      const sent = await mounted.request(matches);
      sent.flush(body);
      await acting;
      return sent.request;
    },
  };
  await mounted.settle();
  return mounted;
}

/** Providers for a dialog component opened outside MatDialog: its data, and a ref whose close() is recorded. */
export function dialogProviders<D>(data: D) {
  const closed: unknown[] = [];
  const ref = {
    close: (value?: unknown) => closed.push(value),
    disableClose: false,
  } as unknown as MatDialogRef<unknown>;
  return {
    closed,
    providers: [
      { provide: MAT_DIALOG_DATA, useValue: data },
      { provide: MatDialogRef, useValue: ref },
    ],
  };
}

/** The error body the server sends for a refused request, as HttpTestingController's flush takes it. */
export function refusal(status: number, message: string, fieldErrors: Record<string, string[]> = {}) {
  return [
    { code: 'refused', message, fieldErrors },
    { status, statusText: 'Refused' },
  ] as const;
}

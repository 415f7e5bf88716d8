import { Component, ErrorHandler } from '@angular/core';
import { DeferBlockBehavior, TestBed } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import {
  Router,
  RouterOutlet,
  provideRouter,
  withComponentInputBinding,
  type Route,
  type Routes,
} from '@angular/router';
import { PureAbility } from '@casl/ability';
import { createAppAbility, defineRulesFor } from '../../shared/authz/app-ability';
import { ROLES } from '../../shared/authz/roles';
import { errorInterceptor } from './core/http/error-interceptor';
import { routes } from './app.routes';

/** Pages that read nothing from the API when opened; every other routed page must show its failed reads inline. */
const NO_READS: Record<string, string> = {
  'sign-in': 'a form; its one call is the sign-in itself',
  verify: 'a form until a hash is given (verify/:hash reads)',
};
/** Query parameters a page needs before it reads anything. */
const QUERY: Record<string, string> = { 'rule-sets/compare': '?from=3&to=4' };
const PARAMS: Record<string, string> = { id: '7', hash: 'ab'.repeat(32) };

/** Every routed page, with its guards left out: guards are tested on their own; here only the reads count. */
function pages(list: Routes, prefix = ''): Route[] {
  return list.flatMap((r) => {
    const path = [prefix, r.path ?? ''].filter(Boolean).join('/');
    if (r.children) return pages(r.children, path);
    return r.loadComponent ? [{ path, pathMatch: r.pathMatch, loadComponent: r.loadComponent }] : [];
  });
}
const PAGES = pages(routes);

const BODIES: Record<number, object> = {
  404: { code: 'not_found', message: 'It was not found' },
  500: { code: 'internal', message: 'Something went wrong on the server; it has been logged.' },
};
const EXPECTED: Record<number, RegExp> = { 404: /was not found/, 500: /The server failed to load/ };

@Component({ imports: [RouterOutlet], template: '<router-outlet />' })
class Host {}

let unexpected: unknown[];

function setUp(): void {
  unexpected = [];
  TestBed.configureTestingModule({
    deferBlockBehavior: DeferBlockBehavior.Manual,
    providers: [
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      provideRouter(PAGES, withComponentInputBinding()),
      { provide: PureAbility, useValue: createAppAbility(defineRulesFor({ id: 1, roles: [...ROLES] })) },
      // A read that reaches the app's ErrorHandler (e.g. value() in the error state) is the defect this spec guards
      // against.
      { provide: ErrorHandler, useValue: { handleError: (e: unknown) => unexpected.push(e) } },
    ],
  });
}

async function settle(): Promise<void> {
  for (let i = 0; i < 3; i++) {
    await new Promise((resolve) => setTimeout(resolve));
    TestBed.tick();
  }
}

/** Answers every request with `status`, round after round, as reads that depend on others start. */
async function failEveryRead(status: number): Promise<number> {
  const http = TestBed.inject(HttpTestingController);
  let count = 0;
  for (let round = 0; round < 6; round++) {
    await settle();
    const open = http.match(() => true);
    if (!open.length) break;
    for (const req of open) req.flush(BODIES[status], { status, statusText: String(status) });
    count += open.length;
  }
  await settle();
  return count;
}

const url = (path: string) => '/' + path.replace(/:(\w+)/g, (_m, name: string) => PARAMS[name]) + (QUERY[path] ?? '');

describe('every routed page, when its reads fail', () => {
  it('lists the pages (so this spec cannot silently test nothing)', () => {
    expect(PAGES.map((p) => p.path)).toEqual(
      expect.arrayContaining(['', 'projects', 'calcs/:id', 'revisions/:id/edit', 'account']),
    );
  });

  describe.each(PAGES.filter((p) => !(p.path! in NO_READS)).map((p) => [p.path!]))('/%s', (path) => {
    it.each([404, 500])(
      'when the API answers %i, then the page says so inline and nothing reaches the error handler',
      async (status) => {
        setUp();
        const fixture = TestBed.createComponent(Host);
        await TestBed.inject(Router).navigateByUrl(url(path));
        const reads = await failEveryRead(status);
        fixture.detectChanges();
        const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
        expect(reads).toBeGreaterThan(0);
        expect(text).toMatch(EXPECTED[status]);
        expect(unexpected).toEqual([]);
      },
    );
  });

  it.each(Object.keys(NO_READS))('/%s reads nothing when opened', async (path) => {
    setUp();
    TestBed.createComponent(Host);
    await TestBed.inject(Router).navigateByUrl(url(path));
    expect(await failEveryRead(500)).toBe(0);
  });
});

import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter, type Routes } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { PREFETCH, RoutePrefetch, prefetchInterceptor } from './route-prefetch';
import { matchRoutes } from './route-match';
import { calcPageReads, editorReads } from '../../route-reads';

@Component({ template: '' })
class Page {}

let loaded: string[];
const lazy = (name: string) => () => (loaded.push(name), Promise.resolve(Page));
const routes: Routes = [
  { path: 'sign-in', loadComponent: lazy('sign-in') },
  {
    path: '',
    loadComponent: lazy('shell'),
    children: [
      { path: '', pathMatch: 'full', loadComponent: lazy('overview') },
      { path: 'calcs/:id', data: { [PREFETCH]: calcPageReads }, loadComponent: lazy('calc page') },
      { path: 'revisions/:id/edit', data: { [PREFETCH]: editorReads }, loadComponent: lazy('editor') },
    ],
  },
  { path: '**', redirectTo: '' },
];

let http: HttpClient;
let backend: HttpTestingController;
let prefetch: RoutePrefetch;
beforeEach(() => {
  loaded = [];
  TestBed.configureTestingModule({
    providers: [
      provideHttpClient(withInterceptors([prefetchInterceptor])),
      provideHttpClientTesting(),
      provideRouter(routes),
    ],
  });
  http = TestBed.inject(HttpClient);
  backend = TestBed.inject(HttpTestingController);
  prefetch = TestBed.inject(RoutePrefetch);
});
afterEach(() => backend.verify());

const boot = (path: string, search = '') => TestBed.runInInjectionContext(() => prefetch.boot(routes, path, search));

describe('the route table read at start-up', () => {
  it('names the chain of routes and their parameters, or nothing for an address no page has', () => {
    expect(matchRoutes(routes, '/calcs/12').map((m) => [m.route.path, m.params])).toEqual([
      ['', {}],
      ['calcs/:id', { id: '12' }],
    ]);
    expect(matchRoutes(routes, '/').map((m) => m.route.path)).toEqual(['', '']);
    expect(matchRoutes(routes, '/calcs/12/extra')).toEqual([]);
    expect(matchRoutes(routes, '/nowhere')).toEqual([]);
  });
});

describe('a screen whose reads started before it was built', () => {
  it('adopts the early answer instead of asking again, and starts loading its scripts at once', async () => {
    boot('/calcs/7', '?rev=21');
    expect(loaded).toEqual(['shell', 'calc page']);
    const calc = firstValueFrom(http.get('/api/calcs/7'));
    const calcRead = backend.expectOne('/api/calcs/7');
    expect(calcRead.request.headers.has('Revision-Form')).toBe(false);
    calcRead.flush({ id: 7 });
    // The revision is read as the page's own read asks for it: its result and checklist as stored.
    const revisionRead = backend.expectOne('/api/revisions/21');
    expect(revisionRead.request.headers.get('Revision-Form')).toBe('stored');
    revisionRead.flush({ id: 21 });
    expect(await calc).toEqual({ id: 7 });
    expect(await firstValueFrom(http.get('/api/revisions/21'))).toEqual({ id: 21 });
    // Adopted once: a later read of the same address asks the server.
    const again = firstValueFrom(http.get('/api/calcs/7'));
    backend.expectOne('/api/calcs/7').flush({ id: 7, again: true });
    expect(await again).toEqual({ id: 7, again: true });
  });

  it("reads the editor's calc and standard as soon as the revision names them", async () => {
    boot('/revisions/3/edit');
    backend.expectOne('/api/revisions/3').flush({ id: 3, calcId: 2, ruleSet: { id: 5 } });
    backend.expectOne('/api/calcs/2').flush({ id: 2 });
    backend.expectOne('/api/rule-sets/5').flush({ id: 5 });
    expect(await firstValueFrom(http.get('/api/rule-sets/5'))).toEqual({ id: 5 });
    expect(await firstValueFrom(http.get('/api/calcs/2'))).toEqual({ id: 2 });
    expect(await firstValueFrom(http.get('/api/revisions/3'))).toEqual({ id: 3, calcId: 2, ruleSet: { id: 5 } });
  });

  it('asks again when the early read failed, so the failure shown is the one of its own read', async () => {
    boot('/calcs/7');
    backend.expectOne('/api/calcs/7').flush(null, { status: 401, statusText: 'Unauthorized' });
    backend.expectOne('/api/calcs/7/latest-revision').flush({ id: 9 });
    const calc = firstValueFrom(http.get('/api/calcs/7'));
    backend.expectOne('/api/calcs/7').flush({ id: 7 });
    expect(await calc).toEqual({ id: 7 });
  });

  it('never adopts an early answer after a write from this browser', async () => {
    boot('/calcs/7');
    void firstValueFrom(http.post('/api/calcs/7/revisions', {}));
    backend.expectOne({ method: 'POST', url: '/api/calcs/7/revisions' }).flush({});
    backend.expectOne('/api/calcs/7').flush({ id: 7, old: true });
    backend.expectOne('/api/calcs/7/latest-revision').flush({ id: 9 });
    const calc = firstValueFrom(http.get('/api/calcs/7'));
    backend.expectOne('/api/calcs/7').flush({ id: 7 });
    expect(await calc).toEqual({ id: 7 });
  });

  it('reads nothing early for an address that names no id', () => {
    boot('/calcs/abc');
    boot('/nowhere');
    backend.expectNone(() => true);
  });
});

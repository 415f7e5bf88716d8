import { Injectable, inject } from '@angular/core';
import { HttpBackend, HttpEvent, HttpInterceptorFn, HttpRequest, HttpResponse } from '@angular/common/http';
import { ActivatedRouteSnapshot, Router, RoutesRecognized, type Route } from '@angular/router';
import { Observable, ReplaySubject, catchError } from 'rxjs';
import { matchRoutes } from './route-match';
import { STORED_FORM_HEADERS, readsStoredForm } from './revision-form';

/**
 * A screen's first reads, declared in its route's `data` under PREFETCH: the GET URLs it will ask for, each with
 * an optional follow-up (reads that need the first answer, e.g. the editor's calc and standard after its revision).
 */
export interface PrefetchRead {
  url: string;
  then?: (body: unknown) => string[];
}
export type PrefetchReads = (
  params: Record<string, string>,
  query: Record<string, string>,
) => (string | PrefetchRead)[];
export const PREFETCH = 'prefetch';

/** An early read is adopted only this soon after it started; later the page reads afresh. */
const LIFETIME_MS = 10_000;

interface Early {
  at: number;
  events: Observable<HttpEvent<unknown>>;
}

/**
 * Starts a screen's first reads as soon as its route is known (at start-up beside the session read, or when the
 * router has recognised an in-app navigation), while its lazy script still loads and its component is built; the
 * page's own identical GET then adopts the answer (prefetchInterceptor) instead of asking again. Each early answer
 * is adopted once; any write from this browser forgets them all, so an early read never predates our own change.
 */
@Injectable({ providedIn: 'root' })
export class RoutePrefetch {
  private readonly backend = inject(HttpBackend);
  private readonly early = new Map<string, Early>();

  /** At start-up: the reads (and the lazy scripts) of the route the address names, before the router runs. */
  boot(routes: Route[], path: string, search: string): void {
    const query: Record<string, string> = {};
    new URLSearchParams(search).forEach((value, key) => (query[key] = value));
    for (const { route, params } of matchRoutes(routes, path)) {
      void route.loadComponent?.();
      this.startAll(route, params, query);
    }
    inject(Router).events.subscribe((e) => {
      if (e instanceof RoutesRecognized) this.recognised(e.state.root, e.state.root.queryParams);
    });
  }

  private recognised(s: ActivatedRouteSnapshot, query: Record<string, string>): void {
    if (s.routeConfig) this.startAll(s.routeConfig, s.params, query);
    for (const child of s.children) this.recognised(child, query);
  }

  private startAll(route: Route, params: Record<string, string>, query: Record<string, string>): void {
    const reads = route.data?.[PREFETCH] as PrefetchReads | undefined;
    for (const read of reads?.(params, query) ?? []) this.start(typeof read === 'string' ? { url: read } : read);
  }

  private start({ url, then }: PrefetchRead): void {
    if (this.early.has(url)) return;
    for (const [key, e] of this.early) if (Date.now() - e.at >= LIFETIME_MS) this.early.delete(key);
    const events = new ReplaySubject<HttpEvent<unknown>>();
    this.early.set(url, { at: Date.now(), events });
    const headers = readsStoredForm(url) ? STORED_FORM_HEADERS : undefined;
    this.backend.handle(new HttpRequest('GET', url, { headers })).subscribe({
      next: (e) => {
        // Follow-ups first: the page, handed the answer next, then finds them already started.
        if (then && e instanceof HttpResponse && e.ok) for (const next of then(e.body)) this.start({ url: next });
        events.next(e);
      },
      error: (err) => {
        events.error(err);
        this.early.delete(url);
      },
      complete: () => events.complete(),
    });
  }

  /** The early answer to `url` if one is fresh (once), else null. */
  take(url: string): Observable<HttpEvent<unknown>> | null {
    const found = this.early.get(url);
    this.early.delete(url);
    return found && Date.now() - found.at < LIFETIME_MS ? found.events : null;
  }

  forget(): void {
    this.early.clear();
  }
}

/** Nearest the network: a GET the route prefetch already started adopts its answer; a write forgets them all. */
export const prefetchInterceptor: HttpInterceptorFn = (req, next) => {
  const prefetch = inject(RoutePrefetch);
  if (req.method !== 'GET') {
    prefetch.forget();
    return next(req);
  }
  const early = prefetch.take(req.urlWithParams);
  // A failed early read is asked again as the page's own, so its failure is reported exactly as without it.
  return early ? early.pipe(catchError(() => next(req))) : next(req);
};

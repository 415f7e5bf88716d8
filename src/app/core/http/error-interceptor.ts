import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { Injector, PendingTasks, inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, finalize, from, switchMap, throwError } from 'rxjs';
import { SessionStore } from '../auth/session-store';
import { ApiFailure } from './api-failure';

/**
 * Turns every failed HTTP answer into one `ApiFailure`, here and nowhere else. A 401 from any call
 * but sign-in itself means the session ended (idle or absolute timeout, deactivation): forget the
 * user and go to the sign-in page, keeping where they were.
 */
export const errorInterceptor: HttpInterceptorFn = (req, next) => {
  // Looked up only on a 401: SessionStore itself calls HttpClient, and most requests never need it.
  const injector = inject(Injector);
  const pendingTasks = inject(PendingTasks);
  return next(req).pipe(
    catchError((error: unknown) => {
      if (!(error instanceof HttpErrorResponse)) return throwError(() => error);
      const isAuthCall = req.url.startsWith('/api/auth/') || req.url === '/api/session';
      const session = error.status === 401 && !isAuthCall ? injector.get(SessionStore) : null;
      if (session?.isSignedIn()) {
        const router = injector.get(Router);
        session.expire();
        void router.navigate(['/sign-in'], { queryParams: { returnTo: router.url, reason: 'expired' } });
      }
      // Reading the body may load the schema first; the app is not stable until the failure is delivered.
      const done = pendingTasks.add();
      const failure = ApiFailure.fromResponse(error.status, error.error);
      return from(failure).pipe(
        switchMap((f) => throwError(() => f)),
        finalize(done),
      );
    }),
  );
};

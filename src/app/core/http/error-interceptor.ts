import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, from, switchMap, throwError } from 'rxjs';
import { SessionStore } from '../auth/session-store';
import { ApiFailure } from './api-failure';

/**
 * Turns every failed HTTP answer into one `ApiFailure`, here and nowhere else. A 401 from any call
 * but sign-in itself means the session ended (idle or absolute timeout, deactivation): forget the
 * user and go to the sign-in page, keeping where they were.
 */
export const errorInterceptor: HttpInterceptorFn = (req, next) => {
  const session = inject(SessionStore);
  const router = inject(Router);
  return next(req).pipe(
    catchError((error: unknown) => {
      if (!(error instanceof HttpErrorResponse)) return throwError(() => error);
      const isAuthCall = req.url.startsWith('/api/auth/') || req.url === '/api/session';
      if (error.status === 401 && !isAuthCall && session.isSignedIn()) {
        session.expire();
        void router.navigate(['/sign-in'], { queryParams: { returnTo: router.url, reason: 'expired' } });
      }
      return from(ApiFailure.fromResponse(error.status, error.error)).pipe(switchMap((failure) => throwError(() => failure)));
    }),
  );
};

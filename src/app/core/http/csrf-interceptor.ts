import { HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { SessionStore } from '../auth/session-store';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Echoes the session's CSRF token on every write to our own API. */
export const csrfInterceptor: HttpInterceptorFn = (req, next) => {
  if (SAFE_METHODS.has(req.method) || !req.url.startsWith('/api/')) return next(req);
  const token = inject(SessionStore).csrfToken();
  return next(token ? req.clone({ setHeaders: { 'x-csrf-token': token } }) : req);
};

import {
  ApplicationConfig,
  ErrorHandler,
  inject,
  provideAppInitializer,
  provideBrowserGlobalErrorListeners,
} from '@angular/core';
import { provideRouter, withComponentInputBinding, withInMemoryScrolling, withPreloading } from '@angular/router';
import { provideHttpClient, withFetch, withInterceptors } from '@angular/common/http';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS } from '@angular/material/form-field';
import { routes } from './app.routes';
import { csrfInterceptor } from './core/http/csrf-interceptor';
import { errorInterceptor } from './core/http/error-interceptor';
import { AppErrorHandler } from './core/errors/app-error-handler';
import { provideAbility } from './core/authz/ability.providers';
import { SessionStore } from './core/auth/session-store';
import { IdlePreloading } from './core/idle-preloading';
import { RoutePrefetch, prefetchInterceptor } from './core/http/route-prefetch';
import { revisionFormInterceptor } from './core/http/revision-form';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideRouter(
      routes,
      withComponentInputBinding(),
      withInMemoryScrolling({ scrollPositionRestoration: 'top' }),
      withPreloading(IdlePreloading),
    ),
    provideHttpClient(
      withFetch(),
      withInterceptors([csrfInterceptor, errorInterceptor, revisionFormInterceptor, prefetchInterceptor]),
    ),
    provideAbility(),
    { provide: ErrorHandler, useClass: AppErrorHandler },
    // Labels always sit above their box: an empty field's label would otherwise run into its unit (GPa, rpm) on a
    // narrow screen, and an engineer reads the label before typing, not after.
    {
      provide: MAT_FORM_FIELD_DEFAULT_OPTIONS,
      useValue: { appearance: 'outline', subscriptSizing: 'dynamic', floatLabel: 'always' },
    },
    // Knowing who is signed in before the first route renders avoids a flash of the sign-in page. Meanwhile the
    // first screen's reads and scripts are already on their way (RoutePrefetch), not queued behind it.
    provideAppInitializer(() => {
      inject(RoutePrefetch).boot(routes, location.pathname, location.search);
      return inject(SessionStore).load();
    }),
  ],
};

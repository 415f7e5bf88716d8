import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { PureAbility } from '@casl/ability';
import type { Action, AppAbility, SubjectName } from '../../../../shared/authz/app-ability';
import { SessionStore } from './session-store';

/** Signed-in pages; anonymous visitors go to sign-in and come back afterwards. */
export const signedInGuard: CanActivateFn = (_route, state) => {
  if (inject(SessionStore).isSignedIn()) return true;
  return inject(Router).createUrlTree(['/sign-in'], { queryParams: { returnTo: state.url } });
};

/** The sign-in page is pointless once signed in. */
export const anonymousGuard: CanActivateFn = () =>
  inject(SessionStore).isSignedIn() ? inject(Router).createUrlTree(['/']) : true;

/** Pages that need a permission; the server still checks every call behind them. */
export function abilityGuard(action: Action, subject: SubjectName): CanActivateFn {
  return () => inject<AppAbility>(PureAbility).can(action, subject) || inject(Router).createUrlTree(['/']);
}

import { type Provider } from '@angular/core';
import { PureAbility } from '@casl/ability';
import { createAppAbility, type AppAbility } from '../../../../shared/authz/app-ability';

/** The client's copy of the shared ability; SessionStore updates its rules on every session change. */
export function provideAbility(): Provider[] {
  return [{ provide: PureAbility, useValue: createAppAbility() }];
}

export type { AppAbility };

import { inject } from '@angular/core';
import { type CanActivateFn, Router } from '@angular/router';
import { Session } from './session';

/** Lets signed-in users through; sends everyone else to sign in, remembering where they were going. */
export const authGuard: CanActivateFn = (_route, state) => {
  if (inject(Session).signedIn()) return true;
  const next = state.url === '/' ? undefined : state.url;
  return inject(Router).createUrlTree(['/sign-in'], { queryParams: { next } });
};

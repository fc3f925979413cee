import { inject } from '@angular/core';
import { type CanActivateFn, Router } from '@angular/router';
import { Session } from './session';

/** Keeps signed-in users off the sign-in page. */
export const signedOutGuard: CanActivateFn = () =>
  inject(Session).signedIn() ? inject(Router).createUrlTree(['/projects']) : true;

import { inject } from '@angular/core';
import { type CanActivateFn, Router } from '@angular/router';
import { Session } from './session';

/** Admin screens: everyone else is sent back to the projects. */
export const adminGuard: CanActivateFn = () =>
  inject(Session).isAdmin() ? true : inject(Router).createUrlTree(['/projects']);

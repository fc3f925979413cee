import { inject } from '@angular/core';
import { type CanActivateFn, Router } from '@angular/router';
import { Session } from './session';

/** Screens that change work (upload, edit, launch): viewers are sent to the project instead. */
export const editorGuard: CanActivateFn = (route) => {
  if (inject(Session).canEdit()) return true;
  const projectId = route.paramMap.get('projectId');
  return inject(Router).createUrlTree(projectId ? ['/projects', projectId] : ['/projects']);
};

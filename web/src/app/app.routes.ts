import type { Routes } from '@angular/router';
import { authGuard } from './core/auth-guard';
import { signedOutGuard } from './core/signed-out-guard';

export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in',
    canActivate: [signedOutGuard],
    loadComponent: () => import('./features/sign-in/sign-in-page').then((m) => m.SignInPage),
  },
  {
    path: '',
    canActivate: [authGuard],
    loadComponent: () => import('./shell/shell').then((m) => m.Shell),
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'projects' },
      {
        path: 'projects',
        title: 'Projects',
        loadComponent: () => import('./features/projects/projects-page').then((m) => m.ProjectsPage),
      },
    ],
  },
  { path: '**', redirectTo: '' },
];

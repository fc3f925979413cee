import type { Routes } from '@angular/router';
import { adminGuard } from './core/admin-guard';
import { authGuard } from './core/auth-guard';
import { editorGuard } from './core/editor-guard';
import { signedOutGuard } from './core/signed-out-guard';

const projectRoutes: Routes = [
  {
    path: '',
    title: 'Projects',
    loadComponent: () => import('./features/projects/projects-page').then((m) => m.ProjectsPage),
  },
  {
    path: ':projectId/recordings/new',
    title: 'Add a recording',
    canActivate: [editorGuard],
    loadComponent: () => import('./features/recordings/recording-upload-page').then((m) => m.RecordingUploadPage),
  },
  {
    path: ':projectId/recordings/:recordingId',
    title: 'Recording',
    loadComponent: () => import('./features/recordings/recording-page').then((m) => m.RecordingPage),
  },
  {
    path: ':projectId/candidate-sets/new',
    title: 'New candidate set',
    canActivate: [editorGuard],
    loadComponent: () => import('./features/candidate-sets/candidate-set-editor').then((m) => m.CandidateSetEditor),
  },
  {
    path: ':projectId/candidate-sets/:setId',
    title: 'Candidate set',
    loadComponent: () => import('./features/candidate-sets/candidate-set-editor').then((m) => m.CandidateSetEditor),
  },
  {
    path: ':projectId/sweeps/new',
    title: 'Launch a sweep',
    canActivate: [editorGuard],
    loadComponent: () => import('./features/sweeps/launch-page').then((m) => m.LaunchPage),
  },
  {
    path: ':projectId/sweeps/:sweepId/models/:modelIndex',
    title: 'Model',
    loadComponent: () => import('./features/models/model-page').then((m) => m.ModelPage),
  },
  {
    path: ':projectId/sweeps/:sweepId',
    title: 'Sweep',
    loadComponent: () => import('./features/sweeps/sweep-page').then((m) => m.SweepPage),
  },
  {
    path: ':projectId',
    loadComponent: () => import('./features/projects/project-page').then((m) => m.ProjectPage),
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'recordings' },
      {
        path: 'recordings',
        title: 'Recordings',
        loadComponent: () => import('./features/projects/project-recordings').then((m) => m.ProjectRecordings),
      },
      {
        path: 'candidate-sets',
        title: 'Candidate sets',
        loadComponent: () => import('./features/projects/project-candidate-sets').then((m) => m.ProjectCandidateSets),
      },
      {
        path: 'sweeps',
        title: 'Sweeps',
        loadComponent: () => import('./features/projects/project-sweeps').then((m) => m.ProjectSweeps),
      },
    ],
  },
];

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
      { path: 'projects', children: projectRoutes },
      {
        path: 'admin',
        canActivate: [adminGuard],
        loadChildren: () => import('./features/admin/admin-routes').then((m) => m.adminRoutes),
      },
    ],
  },
  { path: '**', redirectTo: '' },
];

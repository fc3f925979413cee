import type { Routes } from '@angular/router';
import { AdminPage } from './admin-page';

/** The admin area (behind adminGuard): one tab per concern. */
export const adminRoutes: Routes = [
  {
    path: '',
    component: AdminPage,
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'users' },
      { path: 'users', title: 'Users and roles', loadComponent: () => import('./users-panel').then((m) => m.UsersPanel) },
      { path: 'teams', title: 'Teams', loadComponent: () => import('./teams-panel').then((m) => m.TeamsPanel) },
      { path: 'allowances', title: 'Allowances', loadComponent: () => import('./allowances-panel').then((m) => m.AllowancesPanel) },
      { path: 'audit', title: 'Audit log', loadComponent: () => import('./audit-panel').then((m) => m.AuditPanel) },
      { path: 'mailbox', title: 'Mailbox', loadComponent: () => import('./mailbox-panel').then((m) => m.MailboxPanel) },
    ],
  },
];

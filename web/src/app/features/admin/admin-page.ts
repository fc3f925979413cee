import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';

/** Administration: users and roles, teams, allowances and usage, the audit log and the local mailbox. */
@Component({
  selector: 'app-admin-page',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatIconModule, MatTabsModule],
  template: `
    <header class="page-header">
      <div>
        <h1 class="page-title">Administration</h1>
        <p class="page-subtitle">People and their roles, teams and their compute allowances, and what happened when.</p>
      </div>
    </header>
    <nav mat-tab-nav-bar [tabPanel]="panel" aria-label="Administration sections" class="tabs">
      @for (tab of tabs; track tab.path) {
        <a mat-tab-link [routerLink]="tab.path" routerLinkActive #active="routerLinkActive" [active]="active.isActive">
          <mat-icon aria-hidden="true">{{ tab.icon }}</mat-icon>&nbsp;{{ tab.label }}
        </a>
      }
    </nav>
    <mat-tab-nav-panel #panel><div class="body"><router-outlet /></div></mat-tab-nav-panel>
  `,
  styles: `
    .tabs { border-bottom: 1px solid var(--mat-sys-outline-variant); }
    .tabs mat-icon { width: 20px; height: 20px; font-size: 20px; }
    .body { padding-top: 24px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AdminPage {
  protected readonly tabs = [
    { path: 'users', label: 'Users and roles', icon: 'group' },
    { path: 'teams', label: 'Teams', icon: 'groups' },
    { path: 'allowances', label: 'Allowances', icon: 'speed' },
    { path: 'audit', label: 'Audit log', icon: 'history' },
    { path: 'mailbox', label: 'Mailbox', icon: 'mail' },
  ];
}

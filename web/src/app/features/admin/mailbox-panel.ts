import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { MailboxMessage } from '../../../../../shared/schemas/mailbox';
import { toApiFailure } from '../../core/api-failure';
import { LoadingState } from '../../shared/loading-state';
import { AdminApi } from './admin-api';

/** What the local mailbox received (finished-sweep notices and the like): a list and the open message. */
@Component({
  selector: 'app-mailbox-panel',
  imports: [LoadingState, DatePipe, MatButtonModule, MatIconModule],
  template: `
    <div class="tab-bar">
      <p class="section-note">The local mail receiver keeps every message Conserva sends while it runs on this machine.</p>
      <button mat-stroked-button type="button" (click)="load()"><mat-icon>refresh</mat-icon> Refresh</button>
    </div>
    @if (messages(); as list) {
      @if (list.length === 0) {
        <div class="empty-state"><mat-icon aria-hidden="true">inbox</mat-icon><h2>No messages</h2><p>When a sweep ends, its launcher gets a message; it shows up here.</p></div>
      } @else {
        <div class="mailbox">
          <ul class="list panel" aria-label="Messages">
            @for (m of list; track m.id) {
              <li>
                <button type="button" class="item" [class.open]="open()?.id === m.id" (click)="open.set(m)" [attr.aria-pressed]="open()?.id === m.id">
                  <span class="subject">{{ m.subject }}</span>
                  <span class="meta">{{ m.to.join(', ') }} · {{ m.receivedAt | date: 'd MMM, HH:mm' }}</span>
                </button>
              </li>
            }
          </ul>
          <article class="reader panel" aria-live="polite">
            @if (open(); as m) {
              <h2 class="subject-large">{{ m.subject }}</h2>
              <p class="meta">From {{ m.from }} to {{ m.to.join(', ') }} · {{ m.receivedAt | date: 'd MMM y, HH:mm:ss' }}</p>
              <pre class="text">{{ m.text }}</pre>
            } @else {
              <p class="muted">Choose a message to read it.</p>
            }
          </article>
        </div>
      }
    } @else {
      <app-loading-state [failure]="failure()" label="Loading the mailbox" />
    }
  `,
  styles: `
    .mailbox { display: grid; grid-template-columns: 340px minmax(0, 1fr); gap: 16px; align-items: start; }
    .list { margin: 0; padding: 4px; list-style: none; max-height: 640px; overflow-y: auto; }
    .item {
      display: grid; gap: 2px; width: 100%; padding: 10px 12px; border: 0; border-radius: var(--mat-sys-corner-small);
      background: none; text-align: left; font: inherit; color: inherit; cursor: pointer;
    }
    .item:hover { background: var(--mat-sys-surface-container); }
    .item.open { background: var(--mat-sys-secondary-container); }
    .subject { font: var(--mat-sys-title-small); }
    .meta { font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
    .subject-large { margin: 0; font: var(--mat-sys-title-large); }
    .text { margin: 16px 0 0; white-space: pre-wrap; font: var(--mat-sys-body-medium); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MailboxPanel {
  private readonly adminApi = inject(AdminApi);
  protected readonly messages = signal<MailboxMessage[] | null>(null);
  protected readonly open = signal<MailboxMessage | null>(null);
  protected readonly failure = signal<string | null>(null);

  constructor() {
    void this.load();
  }

  protected async load(): Promise<void> {
    try {
      const messages = await this.adminApi.mailbox();
      this.messages.set(messages);
      if (!this.open() && messages[0]) this.open.set(messages[0]);
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
    }
  }
}

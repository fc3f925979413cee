import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import type { AllowanceList, AllowanceStatus } from '../../../../../shared/schemas/allowance';
import type { WorkerPresence } from '../../../../../shared/schemas/worker-presence';
import { toApiFailure } from '../../core/api-failure';
import { CountPipe } from '../../shared/format/count-pipe';
import { DurationPipe } from '../../shared/format/duration-pipe';
import { LoadingState } from '../../shared/loading-state';
import { AdminApi } from './admin-api';
import { AllowanceEditor } from './allowance-editor';

/** Each team's compute allowance with its use this month, editable; and the workers that serve them all. */
@Component({
  selector: 'app-allowances-panel',
  imports: [LoadingState, DatePipe, MatButtonModule, MatIconModule, AllowanceEditor, CountPipe, DurationPipe],
  template: `
    @if (list(); as l) {
      <p class="section-note">Use in {{ l.month }} (UTC). Reserved time is what queued and running sweeps are still expected to take.</p>
      <ul class="teams">
        @for (a of l.allowances; track a.teamId) {
          <li class="panel team" [attr.aria-label]="'Allowance of ' + a.teamName" data-test="allowance">
            <div class="head">
              <h3 class="name">{{ a.teamName }}</h3>
              @if (editing() !== a.teamId) {
                <button mat-stroked-button type="button" (click)="editing.set(a.teamId)"><mat-icon>tune</mat-icon> Change limits</button>
              }
            </div>
            <div class="usage">
              <div class="bar" role="img" [attr.aria-label]="usageLabel(a)">
                <span class="used" [style.width.%]="percent(a.cpuSecondsUsed, a.cpuSecondsPerMonth)"></span>
                <span class="reserved" [style.width.%]="percent(a.cpuSecondsReserved, a.cpuSecondsPerMonth)"></span>
              </div>
              <p class="legend">
                <span><i class="used"></i>used {{ a.cpuSecondsUsed | duration }}</span>
                <span><i class="reserved"></i>reserved {{ a.cpuSecondsReserved | duration }}</span>
                <span>remaining {{ a.cpuSecondsRemaining | duration }}</span>
              </p>
            </div>
            <dl class="stat-grid">
              <div class="stat"><dt>CPU time per month</dt><dd data-test="cpu-limit">{{ a.cpuSecondsPerMonth | duration }}</dd></div>
              <div class="stat"><dt>Sweeps at once</dt><dd>{{ a.sweepsActive }} running of {{ a.sweepsAtOnce }}</dd></div>
              <div class="stat"><dt>Subsets per sweep</dt><dd>{{ a.subsetsPerSweep | count }}</dd></div>
            </dl>
            @if (editing() === a.teamId) {
              <app-allowance-editor [allowance]="a" (closed)="closeEditor($event)" />
            }
          </li>
        }
      </ul>
    } @else {
      <app-loading-state [failure]="failure()" label="Loading allowances" />
    }

    <section class="panel workers" aria-labelledby="workers-heading">
      <h2 id="workers-heading" class="section-title">Workers</h2>
      @for (w of workers(); track w.id) {
        <p class="worker">
          <span class="dot" [class.alive]="w.alive" aria-hidden="true"></span>
          <span class="mono">{{ w.host }}:{{ w.pid }}</span> · {{ w.threads }} threads · {{ w.alive ? 'reporting' : 'silent since' }} {{ w.lastSeenAt | date: 'd MMM, HH:mm:ss' }}
        </p>
      } @empty {
        <p class="muted">No worker has reported in. Sweeps wait in the queue until one starts.</p>
      }
    </section>
  `,
  styles: `
    .teams { display: grid; gap: 16px; margin: 0; padding: 0; list-style: none; }
    .head { display: flex; justify-content: space-between; align-items: center; gap: 12px; margin-bottom: 10px; }
    .name { margin: 0; font: var(--mat-sys-title-medium); }
    .bar { display: flex; height: 10px; border-radius: 5px; overflow: hidden; background: var(--mat-sys-surface-container-highest); }
    .bar span { display: block; height: 100%; }
    .used, i.used { background: var(--mat-sys-primary); }
    .reserved, i.reserved { background: var(--mat-sys-primary-fixed-dim); }
    .legend { display: flex; flex-wrap: wrap; gap: 4px 14px; margin: 6px 0 12px; font: var(--mat-sys-body-small); }
    .legend i { display: inline-block; width: 10px; height: 10px; margin-right: 4px; border-radius: 2px; vertical-align: -1px; }
    .workers { margin-top: 16px; }
    .worker { display: flex; align-items: center; gap: 8px; margin: 4px 0; }
    .dot { width: 8px; height: 8px; border-radius: 50%; background: var(--mat-sys-outline); }
    .dot.alive { background: #2e8540; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllowancesPanel {
  private readonly adminApi = inject(AdminApi);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly list = signal<AllowanceList | null>(null);
  protected readonly workers = signal<WorkerPresence[]>([]);
  protected readonly failure = signal<string | null>(null);
  protected readonly editing = signal<string | null>(null);

  constructor() {
    void this.load();
  }

  private async load(): Promise<void> {
    try {
      this.list.set(await this.adminApi.allowances());
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
    }
    this.adminApi.workers().then(
      (workers) => this.workers.set(workers),
      () => undefined,
    );
  }

  protected percent(part: number, whole: number): number {
    return whole > 0 ? Math.min(100, (100 * part) / whole) : part > 0 ? 100 : 0;
  }

  protected usageLabel(a: AllowanceStatus): string {
    return `${a.teamName} used ${Math.round(this.percent(a.cpuSecondsUsed, a.cpuSecondsPerMonth))} % of its CPU time this month.`;
  }

  protected closeEditor(updated: AllowanceStatus | null): void {
    this.editing.set(null);
    if (!updated) return;
    this.list.update((l) => (l ? { ...l, allowances: l.allowances.map((a) => (a.teamId === updated.teamId ? updated : a)) } : l));
    this.snackBar.open(`Limits of ${updated.teamName} saved.`, 'Close', { duration: 4000 });
  }
}

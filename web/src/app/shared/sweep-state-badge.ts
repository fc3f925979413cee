import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { SweepState } from '../../../../shared/schemas/sweep';

const looks: Record<SweepState, { label: string; icon: string; tone: string }> = {
  queued: { label: 'Queued', icon: 'schedule', tone: 'neutral' },
  running: { label: 'Running', icon: 'autorenew', tone: 'active' },
  finished: { label: 'Finished', icon: 'check_circle', tone: 'good' },
  cancelled: { label: 'Cancelled', icon: 'block', tone: 'neutral' },
  failed: { label: 'Failed', icon: 'error', tone: 'bad' },
  halted: { label: 'Halted', icon: 'pause_circle', tone: 'warn' },
};

/** A sweep's state as a small coloured label with an icon (never colour alone). */
@Component({
  selector: 'app-sweep-state',
  imports: [MatIconModule],
  template: `<mat-icon aria-hidden="true">{{ look().icon }}</mat-icon><span data-test="sweep-state">{{ look().label }}</span>`,
  styles: `
    :host {
      display: inline-flex; align-items: center; gap: 4px; padding: 2px 10px 2px 6px; border-radius: 999px;
      font: var(--mat-sys-label-large); white-space: nowrap;
    }
    mat-icon { width: 18px; height: 18px; font-size: 18px; }
    :host(.neutral) { background: var(--mat-sys-surface-container-high); color: var(--mat-sys-on-surface-variant); }
    :host(.active) { background: var(--mat-sys-primary-container); color: var(--mat-sys-on-primary-container); }
    :host(.good) { background: #dcefdc; color: #1f4d22; }
    :host(.bad) { background: var(--mat-sys-error-container); color: var(--mat-sys-on-error-container); }
    :host(.warn) { background: #fdf1d8; color: #5c4200; }
  `,
  host: { '[class]': 'look().tone' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepStateBadge {
  readonly state = input.required<SweepState>();
  protected readonly look = computed(() => looks[this.state()]);
}

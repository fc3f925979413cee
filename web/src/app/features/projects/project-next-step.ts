import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { Session } from '../../core/session';
import { SweepStateBadge } from '../../shared/sweep-state-badge';
import { ProjectContext } from './project-context';

/**
 * One line above the tabs that says where to go next: the latest sweep (and its best model once finished),
 * or, for a project still being set up, the next step of the job.
 */
@Component({
  selector: 'app-project-next-step',
  imports: [RouterLink, MatButtonModule, MatIconModule, SweepStateBadge],
  template: `
    @if (latest(); as sweep) {
      <div class="next" data-test="latest-sweep">
        <mat-icon aria-hidden="true">manage_search</mat-icon>
        <span class="label">Latest sweep</span>
        <a class="name" [routerLink]="['sweeps', sweep.id]">{{ sweep.name }}</a>
        <app-sweep-state [state]="sweep.state" />
        <span class="spacer"></span>
        @if (sweep.state === 'finished') {
          <a mat-flat-button [routerLink]="['sweeps', sweep.id, 'models', 0]">Open the best model</a>
        }
        <a mat-stroked-button [routerLink]="['sweeps', sweep.id]">Open the sweep</a>
      </div>
    } @else if (step(); as s) {
      <div class="next">
        <mat-icon aria-hidden="true">flag</mat-icon>
        <span class="label">Next step</span>
        <span>{{ s.text }}</span>
        <span class="spacer"></span>
        <a mat-flat-button [routerLink]="s.link">{{ s.action }}</a>
      </div>
    }
  `,
  styles: `
    .next {
      display: flex; flex-wrap: wrap; align-items: center; gap: 8px 12px; margin: -8px 0 20px; padding: 10px 14px 10px 16px;
      border-radius: var(--mat-sys-corner-large); background: var(--mat-sys-surface); border: 1px solid var(--mat-sys-outline-variant);
    }
    mat-icon { color: var(--mat-sys-primary); }
    .label { font: var(--mat-sys-label-large); color: var(--mat-sys-on-surface-variant); }
    .name { font: var(--mat-sys-title-small); }
    .spacer { flex: 1; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectNextStep {
  private readonly context = inject(ProjectContext);
  private readonly canEdit = inject(Session).canEdit;

  protected readonly latest = computed(() => this.context.sweeps()?.[0] ?? null);
  protected readonly step = computed(() => {
    const recordings = this.context.recordings();
    const sets = this.context.candidateSets();
    const sweeps = this.context.sweeps();
    if (!this.canEdit() || !recordings || !sets || !sweeps) return null;
    // Without recordings the Recordings tab, where the project opens, already says what to do.
    if (recordings.length === 0) return null;
    if (sets.length === 0) return { text: 'Choose the candidate terms the energy may be made of.', action: 'Build a candidate set', link: ['candidate-sets', 'new'] };
    return { text: 'Search the candidate terms for the energy.', action: 'Launch a sweep', link: ['sweeps', 'new'] };
  });
}

import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { SweepEstimate } from '../../../../../shared/schemas/sweep';
import { CountPipe } from '../../shared/format/count-pipe';
import { DurationPipe } from '../../shared/format/duration-pipe';

/**
 * What a launch would cost before it is made: subsets per size, CPU time, the time it takes on the workers
 * that are running now (with its fixed costs) and what these figures rest on, and the share of the team's
 * remaining monthly allowance, with every limit it breaks.
 */
@Component({
  selector: 'app-estimate-panel',
  imports: [MatIconModule, MatProgressBarModule, CountPipe, DurationPipe],
  template: `
    <section class="panel" aria-labelledby="estimate-heading" aria-live="polite" data-test="estimate">
      <h2 id="estimate-heading" class="section-title">Estimate</h2>
      @if (pending()) {
        <mat-progress-bar mode="indeterminate" aria-label="Estimating" class="pending" />
      }
      @if (estimate(); as e) {
        <dl class="figures">
          <div><dt>Subsets</dt><dd data-test="estimate-subsets">{{ e.totalSubsets | count }}</dd></div>
          <div><dt>CPU time</dt><dd>{{ e.cpuSeconds | duration }}</dd></div>
          <div>
            <dt>Expected time</dt>
            <dd>{{ e.wallSeconds === null ? 'no worker running' : (e.wallSeconds | duration) }}</dd>
          </div>
          <div>
            <dt>Of the team's remaining allowance</dt>
            <dd data-test="estimate-share">{{ share() }}</dd>
          </div>
        </dl>
        <div class="allowance">
          <div class="bar" role="img" [attr.aria-label]="allowanceLabel()">
            <span class="used" [style.width.%]="usedPercent()"></span>
            <span class="reserved" [style.width.%]="reservedPercent()"></span>
            <span class="this" [class.over]="!e.fits" [style.width.%]="thisPercent()"></span>
          </div>
          <p class="legend">
            <span><i class="used"></i>used {{ e.allowance.cpuSecondsUsed | duration }}</span>
            <span><i class="reserved"></i>reserved {{ e.allowance.cpuSecondsReserved | duration }}</span>
            <span><i class="this"></i>this sweep</span>
            <span class="muted">of {{ e.allowance.cpuSecondsPerMonth | duration }} allowed in {{ e.allowance.month }}</span>
          </p>
        </div>
        <table class="sizes" aria-label="Subsets per size">
          <thead><tr><th scope="col">Size</th><th scope="col">Subsets</th><th scope="col">CPU time</th></tr></thead>
          <tbody>
            @for (s of e.perSize; track s.size) {
              <tr>
                <th scope="row">{{ s.size }}</th>
                <td>{{ s.subsets | count }}</td>
                <td>{{ s.cpuSeconds | duration }}{{ s.measured ? '' : ' *' }}</td>
              </tr>
            }
          </tbody>
        </table>
        @if (anyUnmeasured()) {
          <p class="muted small">* from a built-in rate; sizes measured on earlier sweeps use their measured rate.</p>
        }
        <div class="basis" data-test="estimate-basis">
          <p><span class="label">Speed per size:</span> {{ e.basis.speed.text }}.</p>
          <p>
            <span class="label">Fixed costs:</span>
            {{ e.fixedCosts.prepareSeconds | duration }} to prepare, {{ e.fixedCosts.shardOverheadSeconds | duration }} to handle each of
            {{ plural(e.shardCount, 'shard') }} on {{ plural(working(), 'thread') }}, {{ e.fixedCosts.finishSeconds | duration }} to finish;
            {{ e.basis.fixedCosts.text }}.
          </p>
        </div>
        <p class="muted small">{{ plural(e.candidateCount, 'candidate') }}, {{ plural(e.knownCount, 'known term') }}, {{ plural(e.workerThreads, 'worker thread') }} running.</p>
        @for (refusal of e.refusals; track refusal.limit) {
          <div class="callout error" role="alert" data-test="estimate-refusal"><mat-icon aria-hidden="true">block</mat-icon><p>{{ refusal.message }}</p></div>
        }
        @for (warning of e.warnings; track $index) {
          <p class="warning"><mat-icon aria-hidden="true">warning</mat-icon>{{ warning }}</p>
        }
      } @else if (!pending()) {
        <p class="muted">{{ hint() }}</p>
      }
    </section>
  `,
  styles: `
    .pending { margin: -4px 0 8px; }
    .figures { display: grid; grid-template-columns: 1fr 1fr; gap: 8px; margin: 0 0 12px; }
    .figures div { padding: 10px 12px; border-radius: var(--mat-sys-corner-medium); background: var(--mat-sys-surface-container); }
    dt { font: var(--mat-sys-label-medium); color: var(--mat-sys-on-surface-variant); }
    dd { margin: 2px 0 0; font: var(--mat-sys-title-medium); font-variant-numeric: tabular-nums; }
    .bar { display: flex; height: 10px; border-radius: 5px; overflow: hidden; background: var(--mat-sys-surface-container-highest); }
    .bar span { display: block; height: 100%; }
    .used, i.used { background: var(--mat-sys-outline); }
    .reserved, i.reserved { background: var(--mat-sys-primary-fixed-dim); }
    .this, i.this { background: var(--mat-sys-primary); }
    .this.over { background: var(--mat-sys-error); }
    .legend { display: flex; flex-wrap: wrap; gap: 4px 12px; margin: 6px 0 12px; font: var(--mat-sys-body-small); }
    .legend i { display: inline-block; width: 10px; height: 10px; margin-right: 4px; border-radius: 2px; vertical-align: -1px; }
    .sizes { width: 100%; border-collapse: collapse; font-variant-numeric: tabular-nums; margin-bottom: 8px; }
    .sizes th, .sizes td { padding: 4px 8px; text-align: right; border-bottom: 1px solid var(--mat-sys-outline-variant); }
    .sizes thead th { font: var(--mat-sys-label-medium); color: var(--mat-sys-on-surface-variant); }
    .small { margin: 4px 0; }
    .basis { margin: 8px 0; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
    .basis p { margin: 4px 0; }
    .basis .label { font: var(--mat-sys-label-medium); color: var(--mat-sys-on-surface); margin-right: 4px; }
    .callout { margin: 10px 0 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EstimatePanel {
  readonly estimate = input<SweepEstimate | null>(null);
  readonly pending = input(false);
  readonly hint = input('Choose a candidate set and at least one training recording.');

  private readonly month = computed(() => Math.max(1, this.estimate()?.allowance.cpuSecondsPerMonth ?? 1));
  protected readonly usedPercent = computed(() => Math.min(100, (100 * (this.estimate()?.allowance.cpuSecondsUsed ?? 0)) / this.month()));
  protected readonly reservedPercent = computed(() =>
    Math.min(100 - this.usedPercent(), (100 * (this.estimate()?.allowance.cpuSecondsReserved ?? 0)) / this.month()),
  );
  protected readonly thisPercent = computed(() =>
    Math.min(100 - this.usedPercent() - this.reservedPercent(), (100 * (this.estimate()?.cpuSeconds ?? 0)) / this.month()),
  );
  protected readonly anyUnmeasured = computed(() => this.estimate()?.perSize.some((s) => !s.measured) ?? false);
  protected readonly share = computed(() => {
    const e = this.estimate();
    if (!e) return '–';
    const remaining = e.allowance.cpuSecondsRemaining;
    if (remaining <= 0) return e.cpuSeconds > 0 ? 'none left' : '0 %';
    const percent = (100 * e.cpuSeconds) / remaining;
    return percent < 0.1 && percent > 0 ? 'under 0.1 %' : `${percent < 10 ? percent.toFixed(1) : Math.round(percent)} %`;
  });
  /** Threads that work at once: no more than there are shards. */
  protected readonly working = computed(() => {
    const e = this.estimate();
    return e ? Math.max(1, Math.min(e.workerThreads, e.shardCount)) : 1;
  });

  protected plural(count: number, noun: string): string {
    return `${count} ${noun}${count === 1 ? '' : 's'}`;
  }

  protected readonly allowanceLabel = computed(() => {
    const e = this.estimate();
    return e ? `This month the team used ${Math.round(this.usedPercent())} % of its CPU allowance; this sweep would take ${this.share()} of what remains.` : '';
  });
}

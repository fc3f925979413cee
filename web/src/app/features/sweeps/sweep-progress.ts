import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { LiveProgress } from '../../../../../shared/schemas/live-message';
import { type SweepDetail, endedSweepStates } from '../../../../../shared/schemas/sweep';
import { CountPipe } from '../../shared/format/count-pipe';
import { DurationPipe } from '../../shared/format/duration-pipe';

/** How far a sweep has come: subsets tried of all, the rate, the time left, time and CPU used so far. */
@Component({
  selector: 'app-sweep-progress',
  imports: [DecimalPipe, MatProgressBarModule, CountPipe, DurationPipe],
  template: `
    <div class="bar-line">
      <mat-progress-bar
        [mode]="sweep().state === 'queued' ? 'buffer' : 'determinate'"
        [value]="percent()"
        aria-label="Subsets tried"
        [attr.aria-valuetext]="percent().toFixed(1) + ' percent of the subsets tried'"
      />
      <span class="percent" data-test="progress-percent">{{ percent() | number: '1.0-1' }} %</span>
    </div>
    <dl class="stat-grid">
      <div class="stat"><dt>Subsets tried</dt><dd data-test="progress-tried">{{ tried() | count }} <span class="of">of {{ total() | count }}</span></dd></div>
      <div class="stat"><dt>Throughput</dt><dd data-test="progress-rate">{{ rate() === null ? '–' : (rate() | count: true) + ' / s' }}</dd></div>
      <div class="stat"><dt>Time left</dt><dd data-test="progress-eta">{{ ended() ? 'none' : (eta() | duration) }}</dd></div>
      <div class="stat"><dt>Running for</dt><dd>{{ elapsed() | duration }}</dd></div>
      <div class="stat"><dt>CPU time</dt><dd>{{ sweep().cpuSeconds | duration }} <span class="of">of ~{{ sweep().estimatedCpuSeconds | duration }}</span></dd></div>
      <div class="stat"><dt>Shards done</dt><dd>{{ sweep().shardsDone }} <span class="of">of {{ sweep().shardCount || '–' }}</span></dd></div>
    </dl>
  `,
  styles: `
    .bar-line { display: flex; align-items: center; gap: 12px; margin-bottom: 14px; }
    mat-progress-bar { flex: 1; --mat-progress-bar-track-height: 8px; --mat-progress-bar-active-indicator-height: 8px; border-radius: 4px; }
    .percent { font: var(--mat-sys-title-medium); font-variant-numeric: tabular-nums; min-width: 64px; text-align: right; }
    .of { font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepProgress {
  readonly sweep = input.required<SweepDetail>();
  readonly progress = input<LiveProgress | null>(null);

  protected readonly ended = computed(() => endedSweepStates.includes(this.sweep().state));
  protected readonly total = computed(() => this.progress()?.totalSubsets ?? this.sweep().totalSubsets);
  protected readonly tried = computed(() => {
    const live = this.progress();
    return live ? live.evaluated + live.rejected : this.sweep().evaluated + this.sweep().rejected;
  });
  protected readonly percent = computed(() => (this.total() > 0 ? Math.min(100, (100 * this.tried()) / this.total()) : 0));
  protected readonly elapsed = computed(() => {
    const live = this.progress();
    if (live && !this.ended()) return live.elapsedSeconds;
    const { startedAt, endedAt } = this.sweep();
    if (!startedAt) return null;
    return ((endedAt ? Date.parse(endedAt) : Date.now()) - Date.parse(startedAt)) / 1000;
  });
  /** The hub's rate over the last seconds while running; otherwise the average since the start. */
  protected readonly rate = computed(() => {
    const live = this.progress();
    if (live && !this.ended() && live.subsetsPerSecond !== null) return live.subsetsPerSecond;
    const elapsed = this.elapsed();
    return elapsed && elapsed > 0 && this.tried() > 0 ? this.tried() / elapsed : null;
  });
  protected readonly eta = computed(() => {
    const live = this.progress()?.etaSeconds;
    if (live !== null && live !== undefined) return live;
    const rate = this.rate();
    return rate && !this.ended() ? Math.max(0, this.total() - this.tried()) / rate : null;
  });
}

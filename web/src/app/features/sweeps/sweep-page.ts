import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, type Signal, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { type SweepDetail, endedSweepStates } from '../../../../../shared/schemas/sweep';
import type { SweepLeaderboard } from '../../../../../shared/schemas/sweep-leaderboard';
import { toApiFailure } from '../../core/api-failure';
import { FailureNotice } from '../../core/failure-notice';
import { LiveSweeps, type LiveSweep } from '../../core/live-sweeps';
import { Session } from '../../core/session';
import { Breadcrumbs } from '../../shared/breadcrumbs';
import type { ChartSeries } from '../../shared/charts/line-chart';
import { LineChart } from '../../shared/charts/line-chart';
import { Confirmation } from '../../shared/confirmation';
import { MathFormula } from '../../shared/math/math-formula';
import { SweepStateBadge } from '../../shared/sweep-state-badge';
import { ProjectNames } from '../projects/project-names';
import { LeaderboardTable } from './leaderboard-table';
import { ShardMap } from './shard-map';
import { SignalNoiseTable } from './signal-noise-table';
import { SweepModels } from './sweep-models';
import { SweepProgress } from './sweep-progress';
import { SweepsApi } from './sweeps-api';

/**
 * One sweep, live: progress, throughput and time left, the shards, the leaderboard as it changes, and the
 * best error per model size. Updates come over the shared WebSocket, which reconnects by itself; the first
 * view comes from the API so the page shows something at once. Once finished, the worked-out models are
 * listed with links to their model views. Analysts and admins can cancel a sweep that has not ended.
 */
@Component({
  selector: 'app-sweep-page',
  imports: [
    DatePipe,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    Breadcrumbs,
    LeaderboardTable,
    LineChart,
    MathFormula,
    ShardMap,
    SignalNoiseTable,
    SweepModels,
    SweepProgress,
    SweepStateBadge,
  ],
  templateUrl: './sweep-page.html',
  styleUrl: './sweep-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepPage {
  private readonly sweepsApi = inject(SweepsApi);
  private readonly liveSweeps = inject(LiveSweeps);
  private readonly projectNames = inject(ProjectNames);
  private readonly confirmation = inject(Confirmation);
  private readonly failureNotice = inject(FailureNotice);
  protected readonly canEdit = inject(Session).canEdit;
  readonly projectId = input.required<string>();
  readonly sweepId = input.required<string>();

  protected readonly projectName = computed(() => this.projectNames.label(this.projectId()));
  protected readonly connection = this.liveSweeps.connectionState;
  private readonly fetched = signal<{ sweep: SweepDetail; leaderboard: SweepLeaderboard } | null>(null);
  private readonly watched = signal<Signal<LiveSweep> | null>(null);
  private readonly live = computed(() => this.watched()?.() ?? null);
  /** The answer of a cancel, shown until the live view reports the end itself. */
  private readonly cancelled = signal<SweepDetail | null>(null);
  protected readonly failure = signal<string | null>(null);
  protected readonly cancelling = signal(false);

  protected readonly sweep = computed(() => {
    // The live view is complete once its first message arrived (every shard, and all of them again once planned);
    // the API's answer shows something until then.
    const current = this.live()?.sweep ?? this.fetched()?.sweep ?? null;
    const cancelled = this.cancelled();
    return cancelled && current && !endedSweepStates.includes(current.state) ? cancelled : current;
  });
  protected readonly leaderboard = computed(() => this.live()?.leaderboard ?? this.fetched()?.leaderboard ?? null);
  protected readonly progress = computed(() => this.live()?.progress ?? null);
  protected readonly liveProblem = computed(() => this.live()?.problem ?? null);
  protected readonly ended = computed(() => {
    const sweep = this.sweep();
    return sweep ? endedSweepStates.includes(sweep.state) : false;
  });
  protected readonly coordinates = computed(() => this.sweep()?.description.coordinates ?? []);
  protected readonly result = computed(() => this.leaderboard()?.result ?? null);

  /** Best error per size: the live leaderboard while running; training, validation and noise floor once finished. */
  protected readonly errorBySize = computed((): ChartSeries[] => {
    const result = this.result();
    if (result && result.front.length) {
      const front = [...result.front].sort((a, b) => a.size - b.size);
      const sizes = front.map((f) => f.size);
      const series: ChartSeries[] = [{ name: 'training error', x: sizes, y: front.map((f) => f.trainRmse), points: true }];
      if (front.some((f) => f.validationRmse !== null)) series.push({ name: 'validation error', x: sizes, y: front.map((f) => f.validationRmse), points: true });
      if (front.some((f) => f.noiseFloorRmse !== null)) series.push({ name: 'noise floor', x: sizes, y: front.map((f) => f.noiseFloorRmse), dashed: true });
      return series;
    }
    const board = this.leaderboard();
    if (!board || board.bySize.length === 0) return [];
    const best = board.bySize
      .filter((s) => s.entries.length > 0)
      .map((s) => ({ size: s.size, rmse: Math.min(...s.entries.map((e) => e.rmse)) }))
      .sort((a, b) => a.size - b.size);
    return [{ name: 'best RMS residual', x: best.map((b) => b.size), y: best.map((b) => b.rmse), points: true }];
  });

  constructor() {
    effect(() => this.projectNames.ensure(this.projectId()));
    effect((onCleanup) => {
      const sweepId = this.sweepId();
      const watch = untracked(() => {
        this.fetched.set(null);
        this.cancelled.set(null);
        void this.fetch(sweepId);
        return this.liveSweeps.watch(sweepId);
      });
      this.watched.set(watch.live);
      onCleanup(() => watch.stop());
    });
  }

  private async fetch(sweepId: string): Promise<void> {
    this.failure.set(null);
    try {
      const [sweep, leaderboard] = await Promise.all([this.sweepsApi.get(sweepId), this.sweepsApi.leaderboard(sweepId)]);
      if (sweepId === this.sweepId()) this.fetched.set({ sweep, leaderboard });
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
    }
  }

  protected simplifiedTerms(dropped: readonly { term: string }[]): string {
    return dropped.map((d) => d.term).join(', ');
  }

  protected async cancel(): Promise<void> {
    const sweep = this.sweep();
    if (!sweep) return;
    const yes = await this.confirmation.ask({
      title: 'Cancel this sweep?',
      message: `“${sweep.name}” stops at the workers' next progress report. The subsets tried so far stay on its leaderboard, but it cannot be resumed.`,
      confirm: 'Cancel sweep',
      keep: 'Keep it running',
      destructive: true,
    });
    if (!yes) return;
    this.cancelling.set(true);
    try {
      this.cancelled.set(await this.sweepsApi.cancel(sweep.id));
    } catch (err) {
      this.failureNotice.show(err);
    } finally {
      this.cancelling.set(false);
    }
  }
}

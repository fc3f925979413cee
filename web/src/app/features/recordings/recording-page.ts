import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router } from '@angular/router';
import type { RecordingChannel, RecordingSamples, RecordingView } from '../../../../../shared/schemas/recording';
import { toApiFailure } from '../../core/api-failure';
import { FailureNotice } from '../../core/failure-notice';
import { Session } from '../../core/session';
import { Breadcrumbs } from '../../shared/breadcrumbs';
import { LineChart } from '../../shared/charts/line-chart';
import { Confirmation } from '../../shared/confirmation';
import { BytesPipe } from '../../shared/format/bytes-pipe';
import { CountPipe } from '../../shared/format/count-pipe';
import { FigurePipe } from '../../shared/format/figure-pipe';
import { ProjectNames } from '../projects/project-names';
import { RecordingsApi } from './recordings-api';

const kindLabels: Record<RecordingChannel['kind'], string> = { time: 'time', position: 'position', velocity: 'velocity', force: 'force on' };
const kindOrder: Record<RecordingChannel['kind'], number> = { time: 0, position: 1, velocity: 2, force: 3 };

/** One recording: its sampling statistics, its column mapping and a plot of every channel against time. */
@Component({
  selector: 'app-recording-page',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, Breadcrumbs, LineChart, BytesPipe, CountPipe, FigurePipe],
  template: `
    <app-breadcrumbs [trail]="[{ label: 'Projects', link: ['/projects'] }, { label: projectName(), link: ['/projects', projectId()] }, { label: 'Recordings', link: ['/projects', projectId(), 'recordings'] }, { label: recording()?.name ?? 'Recording' }]" />
    @if (failure(); as message) {
      <div class="callout error" role="alert"><mat-icon aria-hidden="true">error</mat-icon><p>{{ message }}</p></div>
    }
    @if (recording(); as r) {
      <header class="page-header">
        <div>
          <h1 class="page-title">{{ r.name }}</h1>
          <p class="page-subtitle">
            {{ r.fileName }} · {{ r.sizeBytes | bytes }} · added {{ r.createdAt | date: 'd MMM y, HH:mm' }}{{ r.uploadedBy ? ' by ' + r.uploadedBy.name : '' }}
          </p>
        </div>
        @if (canEdit()) {
          <div class="page-actions">
            <button mat-stroked-button type="button" (click)="remove(r)" [disabled]="r.sweepCount > 0" [attr.title]="r.sweepCount > 0 ? 'Sweeps use this recording, so it is kept.' : null">
              <mat-icon>delete</mat-icon> Delete
            </button>
          </div>
        }
      </header>

      <section class="panel" aria-labelledby="sampling-heading">
        <h2 id="sampling-heading" class="section-title">Sampling</h2>
        <dl class="stat-grid" data-test="sampling-stats">
          <div class="stat"><dt>Samples</dt><dd>{{ r.sampleCount | count }}</dd></div>
          <div class="stat"><dt>Length</dt><dd>{{ r.durationSeconds | figure: 4 }} {{ r.mapping.time.unit }}</dd></div>
          <div class="stat"><dt>Sample rate</dt><dd>{{ r.sampling.sampleRate === null ? '–' : (r.sampling.sampleRate | figure: 4) + ' per ' + r.mapping.time.unit }}</dd></div>
          <div class="stat"><dt>Median step</dt><dd>{{ r.sampling.steps ? (r.sampling.steps.median | figure: 4) : '–' }}</dd></div>
          <div class="stat"><dt>Shortest / longest step</dt><dd>{{ r.sampling.steps ? (r.sampling.steps.min | figure: 3) + ' / ' + (r.sampling.steps.max | figure: 3) : '–' }}</dd></div>
          <div class="stat"><dt>Evenly sampled</dt><dd>{{ r.sampling.uniform ? 'Yes' : 'No' }}</dd></div>
          <div class="stat" [class.warn]="r.sampling.gapCount > 0"><dt>Gaps</dt><dd>{{ r.sampling.gapCount | count }}</dd></div>
          <div class="stat"><dt>Used by sweeps</dt><dd>{{ r.sweepCount | count }}</dd></div>
        </dl>
        @if (r.sampling.gapCount > 0) {
          <p class="note"><mat-icon aria-hidden="true">info</mat-icon> A gap is a step longer than 1.5 times the median step. Derivatives are estimated across gaps with less accuracy.</p>
        }
      </section>

      <section class="panel" aria-labelledby="channels-heading">
        <h2 id="channels-heading" class="section-title">Channels</h2>
        <p class="section-note">
          {{ r.channels.length - 1 }} channels against {{ r.mapping.time.column }} ({{ r.mapping.time.unit }}).
          {{ r.forced ? 'Forces are recorded.' : 'No forces are recorded: the sweep needs a reference term.' }}
          @if (samples(); as s) {
            @if (s.stride > 1) { Plots show one sample in {{ s.stride }}. }
          }
        </p>
        @if (plots(); as list) {
          <div class="plots">
            @for (plot of list; track plot.key) {
              <figure class="plot">
                <figcaption><span class="mono">{{ plot.key }}</span> · {{ plot.caption }}</figcaption>
                 <app-line-chart [series]="plot.series" [xLabel]="'time (' + r.mapping.time.unit + ')'" [height]="200" [ariaLabel]="'Plot of ' + plot.caption + ' against time'" />
              </figure>
            }
          </div>
        } @else {
          <mat-progress-bar mode="indeterminate" aria-label="Loading the samples" />
        }
      </section>
    } @else if (!failure()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the recording" />
    }
  `,
  styles: `
    .warn dd { color: #8a5a00; }
    .note { display: flex; gap: 8px; align-items: center; margin: 12px 0 0; color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-small); }
    .note mat-icon { width: 18px; height: 18px; font-size: 18px; }
    .plots { display: grid; grid-template-columns: repeat(auto-fill, minmax(480px, 1fr)); gap: 16px 20px; }
    .plot { margin: 0; min-width: 0; }
    figcaption { margin-bottom: 4px; font: var(--mat-sys-title-small); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecordingPage {
  private readonly recordingsApi = inject(RecordingsApi);
  private readonly projectNames = inject(ProjectNames);
  private readonly router = inject(Router);
  private readonly confirmation = inject(Confirmation);
  private readonly failureNotice = inject(FailureNotice);
  protected readonly canEdit = inject(Session).canEdit;
  readonly projectId = input.required<string>();
  readonly recordingId = input.required<string>();

  protected readonly projectName = computed(() => this.projectNames.label(this.projectId()));
  protected readonly recording = signal<RecordingView | null>(null);
  protected readonly samples = signal<RecordingSamples | null>(null);
  protected readonly failure = signal<string | null>(null);
  protected readonly plots = computed(() => {
    const samples = this.samples();
    if (!samples) return null;
    const coordinates = this.recording()?.coordinates ?? [];
    const place = (c: RecordingChannel) => kindOrder[c.kind] * 100 + Math.max(0, coordinates.indexOf(c.coordinate ?? ''));
    return [...samples.channels]
      .sort((a, b) => place(a) - place(b))
      .map((channel) => ({
        key: channel.key,
        unit: channel.unit,
        caption: `${kindLabels[channel.kind]}${channel.kind === 'force' ? ` ${channel.coordinate}` : ''}${channel.unit ? ` (${channel.unit})` : ''} · column ${channel.column}`,
        series: [{ name: channel.key, x: samples.time, y: channel.values }],
      }));
  });

  constructor() {
    effect(() => this.projectNames.ensure(this.projectId()));
    effect(() => void this.load(this.recordingId()));
  }

  private async load(recordingId: string): Promise<void> {
    this.recording.set(null);
    this.samples.set(null);
    this.failure.set(null);
    try {
      this.recording.set(await this.recordingsApi.get(recordingId));
      this.samples.set(await this.recordingsApi.samples(recordingId));
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
    }
  }

  protected async remove(recording: RecordingView): Promise<void> {
    const yes = await this.confirmation.ask({
      title: 'Delete this recording?',
      message: `“${recording.name}” and its samples are removed for everyone in the team. This cannot be undone.`,
      confirm: 'Delete recording',
      keep: 'Keep it',
      destructive: true,
    });
    if (!yes) return;
    try {
      await this.recordingsApi.delete(recording.id);
      void this.router.navigate(['/projects', this.projectId(), 'recordings']);
    } catch (err) {
      this.failureNotice.show(err);
    }
  }
}

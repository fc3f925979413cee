import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import type { CandidateSetView } from '../../../../../shared/schemas/candidate-set';
import type { RecordingView } from '../../../../../shared/schemas/recording';
import { type SweepEstimate, sweepLaunchSchema } from '../../../../../shared/schemas/sweep';
import { toApiFailure } from '../../core/api-failure';
import { fieldMessage, schemaIssues, showIssues } from '../../core/schema-issues';
import { Breadcrumbs } from '../../shared/breadcrumbs';
import { CountPipe } from '../../shared/format/count-pipe';
import { DurationPipe } from '../../shared/format/duration-pipe';
import { CandidateSetsApi } from '../candidate-sets/candidate-sets-api';
import { ProjectNames } from '../projects/project-names';
import { RecordingsApi } from '../recordings/recordings-api';
import { EstimatePanel } from './estimate-panel';
import { type RecordingUse, createLaunchForm, toLaunch } from './launch-form-model';
import { SweepsApi } from './sweeps-api';

/** Pause after the last change before the estimate is asked for. */
const estimateDelayMs = 400;

/**
 * Launching a sweep on one page: the candidate set, which recordings train and which validate, the form of
 * the regression, the sizes and the derivative settings, with the estimate beside them updating as they
 * change. A refused launch shows the server's reason (an allowance limit, say) above the form.
 */
@Component({
  selector: 'app-launch-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    MatSelectModule,
    Breadcrumbs,
    CountPipe,
    DurationPipe,
    EstimatePanel,
  ],
  templateUrl: './launch-page.html',
  styleUrl: './launch-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LaunchPage {
  private readonly sweepsApi = inject(SweepsApi);
  private readonly setsApi = inject(CandidateSetsApi);
  private readonly recordingsApi = inject(RecordingsApi);
  private readonly projectNames = inject(ProjectNames);
  private readonly router = inject(Router);
  readonly projectId = input.required<string>();
  /** Preselected candidate set (query parameter `set`). */
  readonly set = input<string>();

  protected readonly projectName = computed(() => this.projectNames.label(this.projectId()));
  protected readonly form = createLaunchForm(inject(FormBuilder));
  private readonly value = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly sets = signal<CandidateSetView[]>([]);
  protected readonly recordings = signal<RecordingView[]>([]);
  protected readonly uses = signal<ReadonlyMap<string, RecordingUse>>(new Map());
  protected readonly loaded = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly refusal = signal<string | null>(null);
  protected readonly estimate = signal<SweepEstimate | null>(null);
  protected readonly estimating = signal(false);
  protected readonly launching = signal(false);
  protected readonly recordingProblem = signal<string | null>(null);
  /** The messages last placed on the form: a signal, so fields show them even when they arrive after a pause. */
  private readonly problems = signal<Record<string, string>>({});

  protected readonly chosenSet = computed(() => {
    this.value();
    return this.sets().find((s) => s.id === this.form.controls.candidateSetId.value) ?? null;
  });
  protected readonly method = computed(() => {
    this.value();
    return this.form.controls.settings.controls.derivatives.controls.method.value;
  });
  protected readonly regressionForm = computed(() => {
    this.value();
    return this.form.controls.settings.controls.form.value;
  });
  /** Why a recording cannot serve the chosen set (a coordinate it does not map), by recording id. */
  protected readonly unusable = computed(() => {
    const set = this.chosenSet();
    const reasons = new Map<string, string>();
    if (!set) return reasons;
    for (const r of this.recordings()) {
      const missing = set.coordinates.filter((c) => !r.coordinates.includes(c));
      if (missing.length) reasons.set(r.id, `Does not map ${missing.join(', ')}`);
    }
    return reasons;
  });
  private readonly launchBody = computed(() => {
    this.value();
    return toLaunch(this.form.getRawValue(), this.uses());
  });

  constructor() {
    effect(() => this.projectNames.ensure(this.projectId()));
    effect(() => {
      const projectId = this.projectId();
      untracked(() => void this.load(projectId));
    });
    let timer: ReturnType<typeof setTimeout> | undefined;
    effect(() => {
      const body = this.launchBody();
      if (!this.loaded()) return;
      clearTimeout(timer);
      timer = setTimeout(() => void this.askEstimate(body), estimateDelayMs);
    });
    inject(DestroyRef).onDestroy(() => clearTimeout(timer));
    // A recording that cannot serve the newly chosen set is taken out of the sweep.
    effect(() => {
      const unusable = this.unusable();
      untracked(() => {
        const uses = new Map(this.uses());
        let changed = false;
        for (const id of unusable.keys()) if (uses.get(id) !== 'skip') (uses.set(id, 'skip'), (changed = true));
        if (changed) this.uses.set(uses);
      });
    });
  }

  private async load(projectId: string): Promise<void> {
    try {
      const [sets, recordings] = await Promise.all([this.setsApi.list(projectId), this.recordingsApi.list(projectId)]);
      this.sets.set(sets);
      this.recordings.set(recordings);
      const preferred = sets.find((s) => s.id === this.set()) ?? sets[0];
      this.form.controls.candidateSetId.setValue(preferred?.id ?? '');
      // The oldest recording trains, the others validate: a sensible start that the user changes at will.
      const uses = new Map<string, RecordingUse>();
      [...recordings].reverse().forEach((r, i) => uses.set(r.id, i === 0 ? 'train' : 'validate'));
      this.uses.set(uses);
      this.loaded.set(true);
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
    }
  }

  protected setUse(recordingId: string, use: RecordingUse): void {
    this.uses.update((uses) => new Map(uses).set(recordingId, use));
    this.recordingProblem.set(null);
  }

  protected message(path: string): string {
    return this.problems()[path] ?? fieldMessage(this.form.get(path));
  }

  private async askEstimate(body: ReturnType<typeof toLaunch>): Promise<void> {
    const issues = schemaIssues(sweepLaunchSchema, body);
    if (Object.keys(issues).length) {
      this.showProblems(issues);
      this.estimate.set(null);
      return;
    }
    this.showProblems({});
    this.estimating.set(true);
    try {
      const estimate = await this.sweepsApi.estimate(this.projectId(), body);
      if (body === this.launchBody()) this.estimate.set(estimate);
    } catch (err) {
      const failure = toApiFailure(err);
      this.estimate.set(null);
      if (Object.keys(failure.fields).length) this.showProblems(failure.fields);
      else this.refusal.set(failure.message);
    } finally {
      this.estimating.set(false);
    }
  }

  /** Messages keyed by the body's paths go next to their fields; recording choices get one line. */
  private showProblems(issues: Record<string, string>): void {
    this.problems.set(issues);
    const unplaced = showIssues(this.form, issues);
    const recordingIssue = Object.entries(unplaced).find(([key]) => /RecordingIds/.test(key));
    this.recordingProblem.set(recordingIssue?.[1] ?? null);
  }

  protected async launch(): Promise<void> {
    if (this.launching()) return;
    this.form.markAllAsTouched();
    this.refusal.set(null);
    const body = this.launchBody();
    const issues = schemaIssues(sweepLaunchSchema, body);
    if (Object.keys(issues).length) {
      this.showProblems(issues);
      this.refusal.set('Some choices need attention; each says what is wrong.');
      return;
    }
    this.launching.set(true);
    try {
      const sweep = await this.sweepsApi.launch(this.projectId(), body);
      void this.router.navigate(['/projects', this.projectId(), 'sweeps', sweep.id]);
    } catch (err) {
      const failure = toApiFailure(err);
      this.refusal.set(failure.message);
      if (failure.code !== 'allowance_exceeded') this.showProblems(failure.fields);
      void this.askEstimate(this.launchBody());
    } finally {
      this.launching.set(false);
    }
  }
}

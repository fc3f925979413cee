import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import type { ModelDetails } from '../../../../../shared/schemas/model-details';
import { safetyCaution } from '../../../../../shared/model/safety-caution';
import type { SweepDetail } from '../../../../../shared/schemas/sweep';
import { toApiFailure } from '../../core/api-failure';
import { Breadcrumbs } from '../../shared/breadcrumbs';
import { CountPipe } from '../../shared/format/count-pipe';
import { FigurePipe } from '../../shared/format/figure-pipe';
import { MathFormula } from '../../shared/math/math-formula';
import { ProjectNames } from '../projects/project-names';
import { SweepsApi } from '../sweeps/sweeps-api';
import { ModelsApi, modelDownloads } from './models-api';
import { FitResidualView } from './fit-residual-view';
import { RecordingCheckView } from './recording-check-view';

/**
 * One model worked out from a sweep: the caution first, then energy, Lagrangian and equations of motion as
 * mathematics, the coefficients, the fit residual of the energy balance, the scores, the simulation against
 * each validation recording, the mass-matrix check, and downloads in every export format.
 */
@Component({
  selector: 'app-model-page',
  imports: [
    MatButtonModule,
    MatExpansionModule,
    MatIconModule,
    MatProgressBarModule,
    MatTableModule,
    Breadcrumbs,
    CountPipe,
    FigurePipe,
    MathFormula,
    FitResidualView,
    RecordingCheckView,
  ],
  templateUrl: './model-page.html',
  styleUrl: './model-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModelPage {
  private readonly modelsApi = inject(ModelsApi);
  private readonly sweepsApi = inject(SweepsApi);
  private readonly projectNames = inject(ProjectNames);
  readonly projectId = input.required<string>();
  readonly sweepId = input.required<string>();
  readonly modelIndex = input.required<string>();

  protected readonly index = computed(() => Number(this.modelIndex()));
  protected readonly projectName = computed(() => this.projectNames.label(this.projectId()));
  protected readonly sweep = signal<SweepDetail | null>(null);
  protected readonly details = signal<ModelDetails | null>(null);
  protected readonly failure = signal<string | null>(null);
  /** Shown even before (or without) an answer: the caution is never missing from this screen. */
  protected readonly caution = computed(() => this.details()?.caution ?? safetyCaution);
  protected readonly title = computed(() => (this.index() === 0 ? 'Best model' : `Model ${this.index() + 1}`));
  protected readonly exports = computed(() =>
    modelDownloads.map((f) => ({ ...f, url: this.modelsApi.exportUrl(this.sweepId(), this.index(), f.format) })),
  );
  protected readonly coefficients = computed(() => {
    const doc = this.details()?.document;
    if (!doc) return [];
    const lagrangian = new Map(doc.lagrangian.terms.map((t) => [t.term, t.coefficient]));
    return doc.energy.terms.map((t) => ({ term: t.term, energy: t.coefficient, lagrangian: lagrangian.has(t.term) ? (lagrangian.get(t.term) ?? null) : null }));
  });
  protected readonly coefficientColumns = ['term', 'typed', 'energy', 'lagrangian'];

  constructor() {
    effect(() => this.projectNames.ensure(this.projectId()));
    effect(() => void this.load(this.sweepId(), this.index()));
  }

  private async load(sweepId: string, index: number): Promise<void> {
    this.details.set(null);
    this.failure.set(null);
    this.sweepsApi.get(sweepId).then(
      (sweep) => this.sweep.set(sweep),
      () => undefined,
    );
    try {
      this.details.set(await this.modelsApi.details(sweepId, index));
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
    }
  }
}

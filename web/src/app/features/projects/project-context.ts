import { Injectable, inject, signal } from '@angular/core';
import type { CandidateSetView } from '../../../../../shared/schemas/candidate-set';
import type { ProjectSummary } from '../../../../../shared/schemas/project';
import type { RecordingView } from '../../../../../shared/schemas/recording';
import type { SweepSummary } from '../../../../../shared/schemas/sweep';
import { toApiFailure } from '../../core/api-failure';
import { CandidateSetsApi } from '../candidate-sets/candidate-sets-api';
import { RecordingsApi } from '../recordings/recordings-api';
import { SweepsApi } from '../sweeps/sweeps-api';
import { ProjectNames } from './project-names';
import { ProjectsApi } from './projects-api';

/**
 * The project page's data, shared by its tabs: the project and its recordings, candidate sets and sweeps.
 * Provided by the project page, so it lives as long as the page.
 */
@Injectable()
export class ProjectContext {
  private readonly projectsApi = inject(ProjectsApi);
  private readonly recordingsApi = inject(RecordingsApi);
  private readonly candidateSetsApi = inject(CandidateSetsApi);
  private readonly sweepsApi = inject(SweepsApi);
  private readonly names = inject(ProjectNames);

  readonly projectId = signal<string | null>(null);
  readonly project = signal<ProjectSummary | null>(null);
  readonly recordings = signal<RecordingView[] | null>(null);
  readonly candidateSets = signal<CandidateSetView[] | null>(null);
  readonly sweeps = signal<SweepSummary[] | null>(null);
  readonly failure = signal<string | null>(null);

  async open(projectId: string): Promise<void> {
    if (this.projectId() === projectId) return;
    this.projectId.set(projectId);
    this.project.set(null);
    this.recordings.set(null);
    this.candidateSets.set(null);
    this.sweeps.set(null);
    this.failure.set(null);
    try {
      const project = await this.projectsApi.get(projectId);
      this.names.remember(project.id, project.name);
      this.project.set(project);
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
      return;
    }
    await Promise.all([this.reloadRecordings(), this.reloadCandidateSets(), this.reloadSweeps()]);
  }

  async reloadRecordings(): Promise<void> {
    await this.load(async (id) => this.recordings.set(await this.recordingsApi.list(id)));
  }

  async reloadCandidateSets(): Promise<void> {
    await this.load(async (id) => this.candidateSets.set(await this.candidateSetsApi.list(id)));
  }

  async reloadSweeps(): Promise<void> {
    await this.load(async (id) => this.sweeps.set(await this.sweepsApi.list(id)));
  }

  private async load(step: (projectId: string) => Promise<void>): Promise<void> {
    const id = this.projectId();
    if (!id) return;
    try {
      await step(id);
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
    }
  }
}

import { Injectable, inject } from '@angular/core';
import {
  type SweepDetail,
  type SweepEstimate,
  type SweepLaunchInput,
  type SweepSummary,
  sweepDetailSchema,
  sweepEstimateSchema,
  sweepListSchema,
} from '../../../../../shared/schemas/sweep';
import { type SweepLeaderboard, sweepLeaderboardSchema } from '../../../../../shared/schemas/sweep-leaderboard';
import { ApiClient } from '../../core/api-client';

/** Sweeps: list a project's, read one and its leaderboard, estimate, launch and cancel. */
@Injectable({ providedIn: 'root' })
export class SweepsApi {
  private readonly api = inject(ApiClient);

  async list(projectId: string): Promise<SweepSummary[]> {
    return (await this.api.get(`/projects/${projectId}/sweeps`, sweepListSchema)).sweeps;
  }

  get(sweepId: string): Promise<SweepDetail> {
    return this.api.get(`/sweeps/${sweepId}`, sweepDetailSchema);
  }

  leaderboard(sweepId: string): Promise<SweepLeaderboard> {
    return this.api.get(`/sweeps/${sweepId}/leaderboard`, sweepLeaderboardSchema);
  }

  estimate(projectId: string, launch: SweepLaunchInput): Promise<SweepEstimate> {
    return this.api.post(`/projects/${projectId}/sweeps/estimate`, launch, sweepEstimateSchema);
  }

  launch(projectId: string, launch: SweepLaunchInput): Promise<SweepDetail> {
    return this.api.post(`/projects/${projectId}/sweeps`, launch, sweepDetailSchema);
  }

  cancel(sweepId: string): Promise<SweepDetail> {
    return this.api.post(`/sweeps/${sweepId}/cancel`, {}, sweepDetailSchema);
  }
}

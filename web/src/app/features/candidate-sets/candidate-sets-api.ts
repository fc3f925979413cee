import { Injectable, inject } from '@angular/core';
import {
  type CandidateSetCheckInput,
  type CandidateSetInputRaw,
  type CandidateSetView,
  type GeneratedTerms,
  type TermCheck,
  type TermGenerateInput,
  candidateSetListSchema,
  candidateSetSchema,
  generatedTermsSchema,
  termCheckSchema,
} from '../../../../../shared/schemas/candidate-set';
import { ApiClient } from '../../core/api-client';

/** Candidate sets of a project, and the server's check and generator (which save nothing). */
@Injectable({ providedIn: 'root' })
export class CandidateSetsApi {
  private readonly api = inject(ApiClient);

  async list(projectId: string): Promise<CandidateSetView[]> {
    return (await this.api.get(`/projects/${projectId}/candidate-sets`, candidateSetListSchema)).candidateSets;
  }

  get(setId: string): Promise<CandidateSetView> {
    return this.api.get(`/candidate-sets/${setId}`, candidateSetSchema);
  }

  create(projectId: string, input: CandidateSetInputRaw): Promise<CandidateSetView> {
    return this.api.post(`/projects/${projectId}/candidate-sets`, input, candidateSetSchema);
  }

  update(setId: string, input: CandidateSetInputRaw): Promise<CandidateSetView> {
    return this.api.put(`/candidate-sets/${setId}`, input, candidateSetSchema);
  }

  delete(setId: string): Promise<void> {
    return this.api.delete(`/candidate-sets/${setId}`);
  }

  check(projectId: string, input: CandidateSetCheckInput): Promise<TermCheck> {
    return this.api.post(`/projects/${projectId}/candidate-sets/check`, input, termCheckSchema);
  }

  generate(projectId: string, input: TermGenerateInput): Promise<GeneratedTerms> {
    return this.api.post(`/projects/${projectId}/candidate-sets/generate`, input, generatedTermsSchema);
  }
}

import { Injectable, inject } from '@angular/core';
import { type ModelDetails, modelDetailsSchema } from '../../../../../shared/schemas/model-details';
import { ApiClient, apiUrl } from '../../core/api-client';

/** The formats a model can be downloaded in, with how they read on screen. */
export const modelExportFormats = [
  { format: 'json', label: 'Model file (JSON)', icon: 'data_object' },
  { format: 'latex', label: 'LaTeX', icon: 'functions' },
  { format: 'python', label: 'Python', icon: 'code' },
  { format: 'typescript', label: 'TypeScript', icon: 'code' },
  { format: 'c', label: 'C', icon: 'memory' },
  { format: 'report', label: 'Report', icon: 'description' },
] as const;
export type ModelExportFormat = (typeof modelExportFormats)[number]['format'];

/** One worked-out model of a finished sweep (by its place in the sweep's result) and its downloads. */
@Injectable({ providedIn: 'root' })
export class ModelsApi {
  private readonly api = inject(ApiClient);

  details(sweepId: string, modelIndex: number): Promise<ModelDetails> {
    return this.api.get(`/sweeps/${sweepId}/models/${modelIndex}`, modelDetailsSchema);
  }

  /** The download address; the server names the file (Content-Disposition). */
  exportUrl(sweepId: string, modelIndex: number, format: ModelExportFormat): string {
    return apiUrl(`/sweeps/${sweepId}/models/${modelIndex}/exports/${format}`);
  }
}

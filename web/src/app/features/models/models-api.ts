import { Injectable, inject } from '@angular/core';
import { type ModelDetails, modelDetailsSchema } from '../../../../../shared/schemas/model-details';
import { type ModelExportFormat, modelExportFormats } from '../../../../../shared/schemas/model-request';
import { ApiClient, apiUrl } from '../../core/api-client';

/** How each download format reads on screen; the record type makes a format added to the API need a label here. */
const looks: Record<ModelExportFormat, { label: string; icon: string }> = {
  json: { label: 'Model file (JSON)', icon: 'data_object' },
  latex: { label: 'LaTeX', icon: 'functions' },
  python: { label: 'Python', icon: 'code' },
  typescript: { label: 'TypeScript', icon: 'code' },
  c: { label: 'C', icon: 'memory' },
  report: { label: 'Report', icon: 'description' },
};

/** The shared list of formats a model can be downloaded in, in the API's order, with how each reads on screen. */
export const modelDownloads = modelExportFormats.map((format) => ({ format, ...looks[format] }));

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

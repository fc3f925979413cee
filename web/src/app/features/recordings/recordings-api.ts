import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import {
  type RecordingInspection,
  type RecordingMappingInput,
  type RecordingSamples,
  type RecordingView,
  recordingInspectionSchema,
  recordingListSchema,
  recordingSamplesSchema,
  recordingSchema,
} from '../../../../../shared/schemas/recording';
import { ApiClient, type UploadStep } from '../../core/api-client';

/** Recordings of a project: list, read, thinned samples for plots, inspect and upload a CSV, delete. */
@Injectable({ providedIn: 'root' })
export class RecordingsApi {
  private readonly api = inject(ApiClient);

  async list(projectId: string): Promise<RecordingView[]> {
    return (await this.api.get(`/projects/${projectId}/recordings`, recordingListSchema)).recordings;
  }

  get(recordingId: string): Promise<RecordingView> {
    return this.api.get(`/recordings/${recordingId}`, recordingSchema);
  }

  samples(recordingId: string, points = 1500): Promise<RecordingSamples> {
    return this.api.get(`/recordings/${recordingId}/samples`, recordingSamplesSchema, { points });
  }

  /** Sends the file to be read without storing it: header, preview rows and numeric columns. */
  inspect(projectId: string, file: File): Observable<UploadStep<RecordingInspection>> {
    const form = new FormData();
    form.append('file', file, file.name);
    return this.api.upload(`/projects/${projectId}/recordings/inspect`, form, recordingInspectionSchema);
  }

  upload(projectId: string, file: File, mapping: RecordingMappingInput, name: string): Observable<UploadStep<RecordingView>> {
    const form = new FormData();
    if (name.trim()) form.append('name', name.trim());
    form.append('mapping', JSON.stringify(mapping));
    form.append('file', file, file.name);
    return this.api.upload(`/projects/${projectId}/recordings`, form, recordingSchema);
  }

  delete(recordingId: string): Promise<void> {
    return this.api.delete(`/recordings/${recordingId}`);
  }
}

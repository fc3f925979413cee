import type { RecordingView } from '../../../shared/schemas/recording.js';
import type { Recording } from '../entities/recording.js';

/** The client's view of a stored recording. */
export function toRecordingView(recording: Recording, sweepCount: number): RecordingView {
  return {
    id: recording.id,
    projectId: recording.project.id,
    name: recording.name,
    fileName: recording.fileName,
    sizeBytes: recording.sizeBytes,
    coordinates: recording.coordinates,
    mapping: recording.mapping,
    channels: recording.channels,
    sampleCount: recording.sampleCount,
    startTime: recording.startTime,
    durationSeconds: recording.durationSeconds,
    sampling: recording.sampling,
    forced: recording.forced,
    uploadedBy: recording.uploadedById ? { id: recording.uploadedById, name: recording.uploadedByName ?? '' } : null,
    createdAt: recording.createdAt.toISOString(),
    sweepCount,
  };
}

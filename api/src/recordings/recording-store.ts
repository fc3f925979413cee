import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { RecordingMapping, UserRef } from '../../../shared/schemas/recording.js';
import type { Project } from '../entities/project.js';
import { Recording } from '../entities/recording.js';
import { RecordingSamples } from '../entities/recording-samples.js';
import type { ParsedRecording } from './recording-parse.js';
import { encodeChannels } from './samples-codec.js';

export interface RecordingToStore {
  project: Project;
  name: string;
  fileName: string;
  sizeBytes: number;
  mapping: RecordingMapping;
  parsed: ParsedRecording;
  uploadedBy: UserRef;
}

/** Adds a parsed recording and its samples to the unit of work (written at the caller's flush or commit). */
export function storeRecording(em: EntityManager, input: RecordingToStore): Recording {
  const { parsed } = input;
  const recording = em.create(Recording, {
    id: randomUUID(),
    project: input.project,
    name: input.name,
    fileName: input.fileName.slice(0, 255),
    sizeBytes: input.sizeBytes,
    coordinates: input.mapping.coordinates.map((c) => c.name),
    mapping: input.mapping,
    channels: parsed.channels,
    sampleCount: parsed.sampleCount,
    startTime: parsed.startTime,
    durationSeconds: parsed.durationSeconds,
    sampling: parsed.sampling,
    forced: parsed.forced,
    uploadedById: input.uploadedBy.id,
    uploadedByName: input.uploadedBy.name,
  });
  em.create(RecordingSamples, { recording, data: encodeChannels(parsed.values) });
  return recording;
}

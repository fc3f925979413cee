import { randomUUID } from 'node:crypto';
import { defineEntity, type InferEntity } from '@mikro-orm/core';
import type { RecordingChannel, RecordingMapping, RecordingSampling } from '../../../shared/schemas/recording.js';
import { Project } from './project.js';

const p = defineEntity.properties;

/**
 * An uploaded recording: its column mapping and what the server measured on it. The samples live apart
 * (RecordingSamples) so lists never load them. Recordings are immutable once stored; deletion is refused
 * while a sweep uses one (sweep descriptions refer to them by id).
 */
export const Recording = defineEntity({
  name: 'Recording',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    project: p.manyToOne(Project).deleteRule('cascade'),
    name: p.string().length(120),
    fileName: p.string().length(255),
    sizeBytes: p.integer(),
    coordinates: p.json<string[]>(),
    mapping: p.json<RecordingMapping>(),
    channels: p.json<RecordingChannel[]>(),
    sampleCount: p.integer(),
    startTime: p.double().$type<number>(),
    durationSeconds: p.double().$type<number>(),
    sampling: p.json<RecordingSampling>(),
    forced: p.boolean(),
    uploadedById: p.uuid().nullable(),
    uploadedByName: p.string().length(120).nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type Recording = InferEntity<typeof Recording>;

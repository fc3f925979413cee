import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { Recording } from './recording.js';

const p = defineEntity.properties;

/**
 * The samples of a recording: one bytea of little-endian float64 values, channel after channel in the order
 * of the recording's `channels` (time first), each `sampleCount` long.
 */
export const RecordingSamples = defineEntity({
  name: 'RecordingSamples',
  properties: {
    recording: p.oneToOne(Recording).primary().deleteRule('cascade'),
    data: p.blob(),
  },
});
export type RecordingSamples = InferEntity<typeof RecordingSamples>;

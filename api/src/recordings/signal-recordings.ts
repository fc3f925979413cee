import type { EntityManager } from '@mikro-orm/postgresql';
import type { Recording as SignalRecording } from '../../../shared/math/recording.js';
import type { FrozenSweepDescription } from '../../../shared/schemas/sweep.js';
import { Recording } from '../entities/recording.js';
import { RecordingSamples } from '../entities/recording-samples.js';
import { decodeChannels } from './samples-codec.js';

/**
 * The sweep's recordings as the engine reads them, from the stored samples: positions in the order of the
 * sweep's coordinates, measured velocities where mapped, forces where mapped (none at all when no coordinate
 * of the sweep has one), each with the role frozen at launch. The values are the CSV's numbers exactly, so
 * the engine sees what the command line would see reading the same files. The worker's prepare and finish
 * steps and the API's model details read them through here.
 */
export async function loadSignalRecordings(em: EntityManager, description: FrozenSweepDescription): Promise<SignalRecording[]> {
  const recordings: SignalRecording[] = [];
  for (const reference of description.recordings) {
    const recording = await em.findOneOrFail(Recording, { id: reference.id });
    const stored = await em.findOneOrFail(RecordingSamples, { recording: reference.id });
    const values = decodeChannels(stored.data, recording.channels.length, recording.sampleCount);
    const channel = (kind: string, coordinate: string | null) => {
      const index = recording.channels.findIndex((c) => c.kind === kind && c.coordinate === coordinate);
      return index < 0 ? null : values[index]!;
    };
    const forces = description.coordinates.map((c) => channel('force', c));
    recordings.push({
      name: recording.name,
      role: reference.role,
      time: channel('time', null)!,
      positions: description.coordinates.map((c) => {
        const positions = channel('position', c);
        if (!positions) throw new Error(`recording ${recording.id} has no position channel for ${c}`);
        return positions;
      }),
      velocities: description.coordinates.map((c) => channel('velocity', c)),
      forces: forces.some((f) => f !== null) ? forces : null,
    });
  }
  return recordings;
}

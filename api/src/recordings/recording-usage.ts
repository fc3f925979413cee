import type { EntityManager } from '@mikro-orm/postgresql';
import { Sweep } from '../entities/sweep.js';

/** How many sweeps of the project use each recording (sweep descriptions list them by id). */
export async function recordingUseCounts(em: EntityManager, projectId: string): Promise<Map<string, number>> {
  const sweeps = await em.find(Sweep, { project: projectId }, { fields: ['description'] });
  const counts = new Map<string, number>();
  for (const sweep of sweeps) {
    for (const { id } of sweep.description.recordings) counts.set(id, (counts.get(id) ?? 0) + 1);
  }
  return counts;
}

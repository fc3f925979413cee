import { sweepSettingsSchema, type SweepSettings } from '../schemas/sweep-description.js';
import type { FrozenSweepDescription } from '../schemas/sweep.js';

/**
 * The engine's settings for a frozen sweep description, through the same schema (and so the same defaults)
 * the command line reads its descriptions with.
 */
export function settingsOfSweep(description: FrozenSweepDescription): SweepSettings {
  return sweepSettingsSchema.parse({
    coordinates: description.coordinates,
    terms: description.terms,
    known: description.known,
    ...(description.reference ? { reference: description.reference } : {}),
    ...description.settings,
  });
}

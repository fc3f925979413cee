import { DiscoveryInputError } from '../math/discovery-input-error.js';

/** An outcome, or the engine's refusal of the input in words (errors do not cross threads as classes). */
export type StepAnswer<T> = { ok: T } | { refused: string };

/** Runs an engine step, turning its refusal of the input (DiscoveryInputError) into words for the caller. */
export function refusalOf<T>(run: () => T): StepAnswer<T> {
  try {
    return { ok: run() };
  } catch (error) {
    if (error instanceof DiscoveryInputError) return { refused: error.message };
    throw error;
  }
}

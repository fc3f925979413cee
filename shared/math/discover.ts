import type { DiscoveryResult } from '../schemas/discovery-result.js';
import type { SweepSettings } from '../schemas/sweep-description.js';
import { splitRankSpace } from './combinations.js';
import { prepareDiscovery } from './discovery-preparation.js';
import { discoveryResultOf } from './discovery-result-assembly.js';
import { selectModels } from './model-selection.js';
import type { Recording } from './recording.js';
import { evaluateSlices } from './sweep-kernel.js';

export interface DiscoveryProgress {
  stage: 'signals' | 'sweep' | 'refit';
  evaluated: number;
  rejected: number;
  /** Subsets in the whole sweep. */
  total: number;
}

export interface DiscoveryOptions {
  onProgress?: (progress: DiscoveryProgress) => void;
  /** Checked during the sweep; returning true ends it early with the models found so far. */
  shouldStop?: () => boolean;
}

const SUBSETS_PER_SLICE = 1_000_000;

/**
 * The whole discovery on recordings already read, in one process: prepare (discovery-preparation.ts), the
 * exhaustive sweep over subsets (sweep-kernel.ts), finish (model-selection.ts), and the result
 * (discovery-result-assembly.ts). Pure: no I/O; throws DiscoveryInputError for anything wrong with the
 * settings or the recordings.
 */
export function discover(settings: SweepSettings, recordings: readonly Recording[], options: DiscoveryOptions = {}): DiscoveryResult {
  const startedAt = performance.now();
  options.onProgress?.({ stage: 'signals', evaluated: 0, rejected: 0, total: 0 });
  const prepared = prepareDiscovery(settings, recordings);
  const { sizes, total } = prepared;
  const outcome = evaluateSlices(prepared.problem, splitRankSpace(prepared.candidateCount, sizes.min, sizes.max, SUBSETS_PER_SLICE), {
    top: settings.top,
    onProgress: (p) => options.onProgress?.({ stage: 'sweep', ...p, total }),
    ...(options.shouldStop ? { shouldStop: options.shouldStop } : {}),
  });
  options.onProgress?.({ stage: 'refit', evaluated: outcome.evaluated, rejected: outcome.rejected, total });
  const selection = selectModels(prepared, settings, outcome);
  return discoveryResultOf(settings, recordings, prepared, outcome, selection, (performance.now() - startedAt) / 1000);
}

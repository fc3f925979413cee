import type { DiscoveryResult } from '../schemas/discovery-result.js';
import type { SweepSettings } from '../schemas/sweep-description.js';
import { safetyCaution } from '../model/safety-caution.js';
import { splitRankSpace } from './combinations.js';
import { prepareDiscovery } from './discovery-preparation.js';
import { selectModels } from './model-selection.js';
import type { Recording } from './recording.js';
import { describeEstimator } from './recording-signals.js';
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
 * exhaustive sweep over subsets (sweep-kernel.ts), finish (model-selection.ts), and the result. Pure: no I/O;
 * throws DiscoveryInputError for anything wrong with the settings or the recordings.
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
  const best = selection.ranked[0];
  const reference = prepared.set.reference;

  return {
    evaluated: outcome.evaluated,
    rejected: outcome.rejected,
    seconds: (performance.now() - startedAt) / 1000,
    form: settings.form,
    balance: settings.form === 'balance' ? settings.balance : null,
    signals: signalReport(settings, recordings, prepared.needAccelerations),
    trainingRows: prepared.training.rowCount,
    validationRows: prepared.validation?.rowCount ?? null,
    candidateCount: prepared.candidateCount,
    known: prepared.set.known.map((t) => t.text),
    reference: reference ? { term: reference.text, coefficient: settings.reference!.coefficient } : null,
    rankedBy: selection.rule.criterion,
    rankingTolerance: selection.rule.tolerance,
    models: selection.ranked.map(({ columns: _columns, ...model }) => model),
    simplification: selection.simplification,
    front: selection.front,
    best: best
      ? {
          terms: best.terms,
          coefficients: best.coefficients,
          energy: best.energy,
          lagrangian: best.lagrangian,
          notIdentifiable: best.notIdentifiable,
        }
      : null,
    excluded: prepared.excluded,
    warnings: [
      ...prepared.warnings,
      ...(outcome.stopped ? ['The sweep was stopped before every subset was evaluated.'] : []),
      ...selection.warnings,
    ],
    caution: safetyCaution,
  };
}

function signalReport(settings: SweepSettings, recordings: readonly Recording[], needAccelerations: boolean): DiscoveryResult['signals'] {
  const measured = recordings.flatMap((r) => r.velocities.map((v) => v !== null));
  const velocities = measured.every(Boolean) ? 'measured' : measured.some(Boolean) ? 'measured and estimated' : 'estimated';
  return {
    estimator: settings.derivatives,
    description: describeEstimator(settings.derivatives),
    velocities,
    accelerations: needAccelerations ? 'estimated' : 'not needed',
  };
}

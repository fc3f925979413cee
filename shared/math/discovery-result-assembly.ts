import { safetyCaution } from '../model/safety-caution.js';
import type { DiscoveryResult } from '../schemas/discovery-result.js';
import type { SweepSettings } from '../schemas/sweep-description.js';
import type { PreparedDiscovery } from './discovery-preparation.js';
import type { ModelSelection } from './model-selection.js';
import type { Recording } from './recording.js';
import { describeEstimator } from './recording-signals.js';
import type { SweepOutcome } from './sweep-problem.js';

/**
 * The result of a discovery (shared/schemas/discovery-result.ts) from its prepare step, the sweep's outcome and
 * the finish step. The command line (discover.ts) and the sweep service (shared/sweeps/prepared-sweep.ts)
 * both report through this one function, so they report alike.
 */
export function discoveryResultOf(
  settings: SweepSettings,
  recordings: readonly Recording[],
  prepared: PreparedDiscovery,
  outcome: SweepOutcome,
  selection: ModelSelection,
  seconds: number,
): DiscoveryResult {
  const best = selection.ranked[0];
  const reference = prepared.set.reference;
  return {
    evaluated: outcome.evaluated,
    rejected: outcome.rejected,
    seconds,
    form: settings.form,
    balance: settings.form === 'balance' ? settings.balance : null,
    signals: { ...signalReport(settings, recordings, prepared.needAccelerations), noise: selection.signalNoise },
    trainingRows: prepared.training.rowCount,
    validationRows: prepared.validation?.rowCount ?? null,
    candidateCount: prepared.candidateCount,
    known: prepared.set.known.map((t) => t.text),
    reference: reference ? { term: reference.text, coefficient: settings.reference!.coefficient } : null,
    rankedBy: selection.rule.criterion,
    rankingTolerance: selection.rule.tolerance,
    models: selection.ranked.map(({ columns: _columns, ...model }) => model),
    simplification: selection.simplification,
    coefficientNoise: selection.coefficientNoise,
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

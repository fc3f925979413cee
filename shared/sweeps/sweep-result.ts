import { safetyCaution } from '../model/safety-caution.js';
import type { PreparedDiscovery } from '../math/discovery-preparation.js';
import type { ModelSelection } from '../math/model-selection.js';
import type { Recording } from '../math/recording.js';
import { describeEstimator } from '../math/recording-signals.js';
import type { SweepOutcome } from '../math/sweep-problem.js';
import type { DiscoveryResult } from '../schemas/discovery-result.js';
import type { SweepSettings } from '../schemas/sweep-description.js';

/**
 * The finished sweep's result in the command line's shape (shared/math/discover.ts assembles the same fields
 * from the same prepare and finish steps), so the service and the command line report alike.
 */
export function sweepResult(
  settings: SweepSettings,
  recordings: readonly Recording[],
  prepared: PreparedDiscovery,
  outcome: SweepOutcome,
  selection: ModelSelection,
  seconds: number,
): DiscoveryResult {
  const best = selection.ranked[0];
  const reference = prepared.set.reference;
  const optional = selection as ModelSelection & { simplification?: unknown };
  return {
    evaluated: outcome.evaluated,
    rejected: outcome.rejected,
    seconds,
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
    ...(optional.simplification !== undefined ? { simplification: optional.simplification } : {}),
    front: selection.front,
    best: best
      ? { terms: best.terms, coefficients: best.coefficients, energy: best.energy, lagrangian: best.lagrangian, notIdentifiable: best.notIdentifiable }
      : null,
    excluded: prepared.excluded,
    warnings: [...prepared.warnings, ...(outcome.stopped ? ['The sweep was stopped before every subset was evaluated.'] : []), ...selection.warnings],
    caution: safetyCaution,
  } as DiscoveryResult;
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

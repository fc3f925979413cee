import type { CandidateTerm } from './candidate-term.js';
import { conservedDifference, type ConservedDifference } from './conserved-difference.js';
import { energyOnSamples, relativeEnergyDifference } from './energy-on-samples.js';
import type { WorkedModel } from './leaderboard-models.js';
import type { RecordingSignals } from './recording-signals.js';

/**
 * Scores closer to the best than these margins do not tell models apart (common practice, no source): a BIC
 * difference below 2 is customarily read as no real evidence either way, and validation errors within 5 % of
 * each other (or closer than the residual noise alone gives on the validation recordings) are treated alike.
 */
export const INDISTINGUISHABLE_VALIDATION_RATIO = 0.05;
export const INDISTINGUISHABLE_BIC = 2;
/** Energies closer than this (relative rms on the training samples) count as the same model. */
export const SAME_ENERGY_TOLERANCE = 1e-2;

export type RankingCriterion = 'validation' | 'bic';

export interface RankingRule {
  criterion: RankingCriterion;
  /** Scores within this distance of the best are indistinguishable from it. */
  tolerance: number;
  /** Sizes above this one (where growth stopped at the noise floor) come after all others; null for none. */
  stopSize: number | null;
}

/** The tolerance of a criterion given the best validation error and its noise floor (null for BIC). */
export function rankingTolerance(criterion: RankingCriterion, bestValidation: number | null, validationFloor: number | null): number {
  if (criterion === 'bic') return INDISTINGUISHABLE_BIC;
  return Math.max(INDISTINGUISHABLE_VALIDATION_RATIO * (bestValidation ?? 0), validationFloor ?? 0);
}

export function scoreOf(model: WorkedModel, criterion: RankingCriterion): number {
  return criterion === 'validation' ? model.validationRmse! : model.bic;
}

/**
 * Orders worked models best first (method.md section 3): by validation error when validation recordings
 * exist, otherwise by BIC, preferring the smaller model among those the data cannot tell from the best.
 * 1. Models of sizes above `stopSize` go last.
 * 2. Among the rest, the models within `tolerance` of the best score come first, smallest first (then by
 *    score): a term that improves the score by less than the data can resolve is not worth having.
 * 3. Then every other model by score.
 */
export function rankModels(models: readonly WorkedModel[], rule: RankingRule): WorkedModel[] {
  const score = (m: WorkedModel) => scoreOf(m, rule.criterion);
  const beyondStop = (m: WorkedModel) => (rule.stopSize !== null && m.size > rule.stopSize ? 1 : 0);
  const eligible = models.filter((m) => !beyondStop(m));
  const best = Math.min(...(eligible.length > 0 ? eligible : models).map(score));
  const tied = (m: WorkedModel) => (!beyondStop(m) && score(m) <= best + rule.tolerance ? 0 : 1);
  return [...models].sort(
    (a, b) =>
      beyondStop(a) - beyondStop(b) ||
      tied(a) - tied(b) ||
      (tied(a) === 0 ? a.size - b.size : 0) ||
      score(a) - score(b) ||
      a.size - b.size,
  );
}

/**
 * Warns when models other than the chosen one score within the tolerance of the best but describe a
 * different energy on the training samples: the data given do not decide between them (method.md
 * section 3, the known trap). When the difference of the two energies is itself conserved along every
 * training recording (conserved-difference.ts), the warning names it: the recordings conserve a second
 * quantity, and only data in which it changes can separate the energy from the energy plus that quantity.
 */
export function indistinguishableWarning(
  ranked: readonly WorkedModel[],
  rule: RankingRule,
  termsOf: (model: WorkedModel) => CandidateTerm[],
  signals: readonly RecordingSignals[],
): string | null {
  const [chosen, ...rest] = ranked;
  if (!chosen) return null;
  const eligible = ranked.filter((m) => rule.stopSize === null || m.size <= rule.stopSize);
  const best = Math.min(...eligible.map((m) => scoreOf(m, rule.criterion)));
  const close = rest.filter(
    (m) => (rule.stopSize === null || m.size <= rule.stopSize) && scoreOf(m, rule.criterion) <= best + rule.tolerance,
  );
  const chosenEnergy = energyOnSamples(termsOf(chosen), chosen.coefficients, signals);
  const rivals = close.filter(
    (m) => relativeEnergyDifference(chosenEnergy, energyOnSamples(termsOf(m), m.coefficients, signals)) > SAME_ENERGY_TOLERANCE,
  );
  if (rivals.length === 0) return null;
  const measure = rule.criterion === 'validation' ? 'validation errors' : 'BIC values';
  const undecided =
    `The data given do not decide between the chosen model (${chosen.terms.join(', ')}) and ` +
    `${rivals.map((m) => `(${m.terms.join(', ')})`).join(', ')}: their ${measure} are within ` +
    `${rule.tolerance.toPrecision(3)} of the best, yet their energies differ on the training samples.`;
  const asPair = (m: WorkedModel) => ({ terms: termsOf(m), coefficients: m.coefficients });
  const conserved = rivals
    .map((m) => ({ rival: m, difference: conservedDifference(asPair(chosen), asPair(m), signals) }))
    .find((d): d is { rival: WorkedModel; difference: ConservedDifference } => d.difference !== null);
  if (!conserved) {
    return `${undecided} Add recordings from other initial conditions, forced recordings or validation recordings.`;
  }
  return (
    `${undecided} The training recordings also conserve another quantity, ${conserved.difference.text} (the energy ` +
    `of (${conserved.rival.terms.join(', ')}) minus the chosen one; along each recording it varies by ` +
    `${conserved.difference.variation.toExponential(1)} of the size of its parts), so any multiple of it can be ` +
    'added to the energy without changing the fit. Add forced recordings, or ' +
    'recordings in which that quantity changes (push or brake a coordinate that otherwise moves freely, for example).'
  );
}

import type { CandidateTerm } from './candidate-term.js';
import { concatenate } from './form-rows.js';
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
 * section 3, the known trap).
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
    (m) => relativeDifference(chosenEnergy, energyOnSamples(termsOf(m), m.coefficients, signals)) > SAME_ENERGY_TOLERANCE,
  );
  if (rivals.length === 0) return null;
  const measure = rule.criterion === 'validation' ? 'validation errors' : 'BIC values';
  return (
    `The data given do not decide between the chosen model (${chosen.terms.join(', ')}) and ` +
    `${rivals.map((m) => `(${m.terms.join(', ')})`).join(', ')}: their ${measure} are within ` +
    `${rule.tolerance.toPrecision(3)} of the best, yet their energies differ on the training samples. Add ` +
    'recordings from other initial conditions, forced recordings or validation recordings.'
  );
}

function energyOnSamples(terms: CandidateTerm[], coefficients: readonly number[], signals: readonly RecordingSignals[]): Float64Array {
  const energy = new Float64Array(signals.reduce((sum, s) => sum + s.length, 0));
  terms.forEach((term, j) => {
    const values = concatenate(signals.map((s) => term.value(s.samples)));
    for (let i = 0; i < energy.length; i++) energy[i] = energy[i]! + coefficients[j]! * values[i]!;
  });
  return energy;
}

/** rms of (a - b) with their means removed, relative to the rms of a with its mean removed. */
function relativeDifference(a: Float64Array, b: Float64Array): number {
  const n = a.length;
  let meanA = 0;
  let meanB = 0;
  for (let i = 0; i < n; i++) {
    meanA += a[i]! / n;
    meanB += b[i]! / n;
  }
  let diff = 0;
  let size = 0;
  for (let i = 0; i < n; i++) {
    diff += (a[i]! - meanA - b[i]! + meanB) ** 2;
    size += (a[i]! - meanA) ** 2;
  }
  return size > 0 ? Math.sqrt(diff / size) : diff > 0 ? Infinity : 0;
}

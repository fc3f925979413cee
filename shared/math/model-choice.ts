import type { CandidateTerm } from './candidate-term.js';
import { concatenate } from './form-rows.js';
import type { WorkedModel } from './leaderboard-models.js';
import type { RecordingSignals } from './recording-signals.js';

/**
 * Two models whose validation errors differ by less than this fraction, or whose BIC differ by less than
 * INDISTINGUISHABLE_BIC, are called indistinguishable (common practice, no source: a BIC difference below 2
 * is customarily read as no real evidence either way).
 */
export const INDISTINGUISHABLE_VALIDATION_RATIO = 0.05;
export const INDISTINGUISHABLE_BIC = 2;
/** Energies closer than this (relative rms on the training samples) are the same model for the warning. */
export const SAME_ENERGY_TOLERANCE = 1e-2;

export type RankingCriterion = 'validation' | 'bic';

/**
 * Orders worked models best first (method.md section 3): by validation error when validation recordings
 * exist, otherwise by BIC. Models of sizes above `stopSize` (where growth stopped at the noise floor) come
 * after all others. Ties go to the smaller model.
 */
export function rankModels(models: WorkedModel[], criterion: RankingCriterion, stopSize: number | null): WorkedModel[] {
  const beyondStop = (m: WorkedModel) => (stopSize !== null && m.size > stopSize ? 1 : 0);
  const score = (m: WorkedModel) => (criterion === 'validation' ? m.validationRmse! : m.bic);
  return [...models].sort((a, b) => beyondStop(a) - beyondStop(b) || score(a) - score(b) || a.size - b.size);
}

/**
 * Warns when models just behind the best score about as well but describe a different energy on the
 * training samples: the data given do not decide between them (method.md section 3, the known trap).
 */
export function indistinguishableWarning(
  ranked: readonly WorkedModel[],
  criterion: RankingCriterion,
  termsOf: (model: WorkedModel) => CandidateTerm[],
  signals: readonly RecordingSignals[],
): string | null {
  const [best, ...rest] = ranked;
  if (!best) return null;
  const close = rest.filter((m) =>
    criterion === 'validation'
      ? m.validationRmse! <= best.validationRmse! * (1 + INDISTINGUISHABLE_VALIDATION_RATIO)
      : m.bic - best.bic < INDISTINGUISHABLE_BIC,
  );
  const bestEnergy = energyOnSamples(termsOf(best), best.coefficients, signals);
  const rivals = close.filter(
    (m) => relativeDifference(bestEnergy, energyOnSamples(termsOf(m), m.coefficients, signals)) > SAME_ENERGY_TOLERANCE,
  );
  if (rivals.length === 0) return null;
  const measure = criterion === 'validation' ? 'validation error within 5%' : 'BIC within 2';
  return (
    `The data given do not decide between the best model (${best.terms.join(', ')}) and ` +
    `${rivals.map((m) => `(${m.terms.join(', ')})`).join(', ')}: ${measure}, yet different energies on the ` +
    `training samples. Add recordings from other initial conditions, forced recordings or validation recordings.`
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

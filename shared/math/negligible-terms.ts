import { relativeEnergyDifference } from './energy-on-samples.js';
import { workOutModel, type ModelContext, type WorkedModel } from './leaderboard-models.js';

/**
 * A candidate term is negligible when leaving it out (and re-fitting the others) changes the model's energy
 * by less than this fraction of the energy's variation on the training samples (rms, means removed). Our
 * choice: ten times finer than the 1e-3 relative coefficient accuracy we claim on clean data, and far above
 * the 1e-6..1e-5 that fitting the derivative estimator's own error gives an extra term (measured on the
 * forced pendulum of the command-line example, see README.md).
 */
export const NEGLIGIBLE_ENERGY_CHANGE = 1e-4;

export interface DroppedTerm {
  term: string;
  /** Its energy coefficient in the model it was dropped from. */
  coefficient: number;
  /**
   * rms change of the energy, relative to its variation, from the first-ranked model to the one without this
   * term (and any dropped before it).
   */
  energyChange: number;
}

export interface Simplification {
  /** The model without its negligible terms (the model given when none was). */
  model: WorkedModel;
  /** The terms left out, in the order they were dropped. */
  dropped: DroppedTerm[];
}

/**
 * Leaves out, one at a time, the candidate terms of a model that do not change its energy: at each step the
 * member whose removal (with the others re-fitted on the training rows) moves the energy least is dropped,
 * as long as the result stays within `tolerance` of the original model's energy on the training samples
 * and no smaller than `minSize`. Known terms are never dropped.
 *
 * Why a rule beside BIC and the validation tolerance: both read a smaller residual as evidence, which is
 * right when the residual is noise. On clean or finely sampled data the residual is mostly the systematic
 * error of the derivative estimator or of the integration rule; an extra term can fit part of it, lower the
 * residual by half and win by hundreds of BIC units, while changing the energy, the thing the model is for,
 * by a few parts in a million.
 */
export function dropNegligibleTerms(
  chosen: WorkedModel,
  context: ModelContext,
  minSize: number,
  energyOf: (model: WorkedModel) => Float64Array,
  tolerance = NEGLIGIBLE_ENERGY_CHANGE,
): Simplification {
  const knownCount = context.training.knownCount;
  const original = energyOf(chosen);
  const dropped: DroppedTerm[] = [];
  let current = chosen;
  while (current.size > minSize) {
    const members = current.columns.slice(knownCount).map((column) => column - knownCount);
    let step: { model: WorkedModel; change: number; index: number } | null = null;
    for (let index = 0; index < members.length; index++) {
      const model = workOutModel({ size: members.length - 1, members: members.filter((_, k) => k !== index) }, context);
      const change = relativeEnergyDifference(original, energyOf(model));
      if (step === null || change < step.change) step = { model, change, index };
    }
    if (step === null || !(step.change < tolerance)) break;
    const position = knownCount + step.index;
    dropped.push({ term: current.terms[position]!, coefficient: current.coefficients[position]!, energyChange: step.change });
    current = step.model;
  }
  return { model: current, dropped };
}

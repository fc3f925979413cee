import type { CandidateTerm } from './candidate-term.js';
import { concatenate, rootMeanSquare } from './form-rows.js';
import type { RecordingSignals } from './recording-signals.js';
import { refitColumns } from './refit.js';

/** Relative size below which a term's Legendre column counts as zero (velocity degree one, up to rounding). */
export const LEGENDRE_ZERO_TOLERANCE = 1e-9;

export interface LegendreResult {
  /** Lagrangian coefficient per term, null for terms the energy cannot determine. */
  coefficients: (number | null)[];
  /** Terms whose Legendre column is zero on the samples (velocity degree one). */
  notIdentifiable: string[];
  /** rms(Lambda d - E) / rms(E): zero when the energy is the Hamiltonian of a Lagrangian over the same terms. */
  relativeResidual: number;
}

/**
 * From energy to Lagrangian (method.md section 4; the Legendre transform H = sum_i dq_i dL/ddq_i - L, any
 * mechanics handbook, e.g. Goldstein ch. 8): with L = sum_j d_j theta_j, H is linear in d with columns
 * Lambda_j = sum_i dq_i d theta_j/d dq_i - theta_j, so d solves Lambda d = E in least squares on the
 * samples. Kinetic terms (degree 2) keep their coefficient, potential terms (degree 0) change sign, terms of
 * degree one give a zero column and are reported as not identifiable instead of being fitted.
 */
export function lagrangianFromEnergy(
  terms: readonly CandidateTerm[],
  energyCoefficients: readonly number[],
  signals: readonly RecordingSignals[],
): LegendreResult {
  const values = terms.map((term) => concatenate(signals.map((s) => term.value(s.samples))));
  const brackets = terms.map((term) => concatenate(signals.map((s) => term.legendreBracket(s.samples))));
  const energy = new Float64Array(values[0]?.length ?? 0);
  values.forEach((column, j) => {
    for (let i = 0; i < energy.length; i++) energy[i] = energy[i]! + energyCoefficients[j]! * column[i]!;
  });
  const identifiable = brackets.map((bracket, j) => rootMeanSquare(bracket) > LEGENDRE_ZERO_TOLERANCE * rootMeanSquare(values[j]!));
  const fit = refitColumns(
    brackets.filter((_, j) => identifiable[j]),
    energy,
  );
  let next = 0;
  const coefficients = terms.map((_, j) => (identifiable[j] ? fit.coefficients[next++]! : null));
  const energySize = rootMeanSquare(energy);
  return {
    coefficients,
    notIdentifiable: terms.filter((_, j) => !identifiable[j]).map((t) => t.text),
    relativeResidual: energySize > 0 ? Math.sqrt(fit.rss / energy.length) / energySize : 0,
  };
}

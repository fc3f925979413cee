import { rootMeanSquare } from './form-rows.js';

/**
 * Share of the regression's right side that the chosen model leaves unexplained beyond what noise accounts for,
 * from which a warning is given. Measured (README, "What the warnings catch"): with clean signals the true terms
 * leave at most 0.055 of it unexplained (double pendulum, derivative form), unrecorded viscous friction of
 * damping ratio 0.6 % on a forced pendulum 0.13, and a candidate set without a true term 0.34 or more. Noisy
 * signals bias the fit beyond the noise floor, which measures only the spread noise gives the residual: there
 * the true terms left up to 0.2 unexplained, so the warning waits for more once the signals are reported noisy.
 */
export const UNEXPLAINED_WARNING = 0.1;
export const UNEXPLAINED_WARNING_NOISY = 0.25;

export interface ChosenFit {
  terms: readonly string[];
  trainRmse: number;
  /** The residual the noise in the recordings alone would give this model, when estimated. */
  noiseFloorRmse: number | null;
}

/** sqrt(max(0, rmse^2 - floor^2)) / rms(y): the part of the residual that noise does not explain, relative to y. */
export function unexplainedShare(fit: ChosenFit, rhs: Float64Array): number {
  const scale = rootMeanSquare(rhs);
  if (!(scale > 0)) return 0;
  const floor = fit.noiseFloorRmse ?? 0;
  return Math.sqrt(Math.max(0, fit.trainRmse ** 2 - floor ** 2)) / scale;
}

/** A warning when the chosen model leaves a large part of the data unexplained by anything but a missing piece. */
export function unexplainedResidualWarning(
  fit: ChosenFit,
  rhs: Float64Array,
  form: 'derivative' | 'balance',
  noisySignals: boolean,
): string | null {
  const share = unexplainedShare(fit, rhs);
  if (share < (noisySignals ? UNEXPLAINED_WARNING_NOISY : UNEXPLAINED_WARNING)) return null;
  const side = form === 'derivative' ? 'power' : 'energy change over the windows';
  return (
    `The chosen model (${fit.terms.join(', ')}) leaves about ${Math.round(100 * share)} % of the ${side} unexplained, ` +
    'more than the noise estimated in the recordings accounts for. A term of the true energy may be missing from ' +
    'the candidates (add terms, or raise the largest size); the machine may gain or lose energy through something ' +
    'the recordings do not carry (friction, damping, a drive whose force is not mapped); or a derivative window too ' +
    'wide for the motion may distort the signals (compare a sweep with a narrower one).'
  );
}

import type { CoefficientNoiseReport, CoordinateNoise } from '../schemas/discovery-result.js';
import type { SweepSettings } from '../schemas/sweep-description.js';
import { coefficientNoise } from './coefficient-noise.js';
import type { PreparedDiscovery } from './discovery-preparation.js';
import type { WorkedModel } from './leaderboard-models.js';
import { measureSignalNoise } from './signal-noise.js';
import { signalNoiseWarning } from './signal-noise-warning.js';
import { unexplainedResidualWarning } from './unexplained-residual.js';

export interface NoiseDiagnosis {
  signalNoise: CoordinateNoise[];
  /** The chosen model's coefficients under more noise; null without a chosen model. */
  coefficientNoise: CoefficientNoiseReport | null;
  warnings: string[];
}

/**
 * What noise does to a discovery, and what noise cannot explain: the noise share of every estimated signal
 * (signal-noise.ts), how far noise of the recorded size moves the chosen model's coefficients
 * (coefficient-noise.ts), a warning when either is large enough to matter (signal-noise-warning.ts), and a
 * warning when the chosen model leaves more unexplained than noise accounts for (unexplained-residual.ts).
 */
export function diagnoseNoise(
  prepared: PreparedDiscovery,
  settings: SweepSettings,
  chosen: WorkedModel | undefined,
  noiseFloorOf: (model: WorkedModel) => number,
  normal: () => number,
): NoiseDiagnosis {
  const { train, symbols, needAccelerations, training } = prepared;
  const signalNoise = measureSignalNoise(train, prepared.trainingSignals, symbols, settings.derivatives, needAccelerations, normal);
  const fitted = chosen ? chosen.columns.map((j) => training.terms[j]!) : [];
  const report = chosen
    ? coefficientNoise(fitted, chosen.coefficients.slice(0, fitted.length), prepared.set.reference, train, settings, symbols, needAccelerations, normal)
    : null;
  const warnings: string[] = [];
  const noisy = signalNoiseWarning(signalNoise, report, settings.derivatives);
  if (noisy) warnings.push(noisy);
  const unexplained = chosen
    ? unexplainedResidualWarning({ ...chosen, noiseFloorRmse: noiseFloorOf(chosen) }, training.rhs, settings.form, noisy !== null)
    : null;
  if (unexplained) warnings.push(unexplained);
  return { signalNoise, coefficientNoise: report, warnings };
}

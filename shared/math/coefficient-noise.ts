import type { CoefficientNoiseReport } from '../schemas/discovery-result.js';
import type { SweepSettings } from '../schemas/sweep-description.js';
import type { CandidateTerm } from './candidate-term.js';
import { channelNoise, perturb } from './noise-floor.js';
import type { Recording } from './recording.js';
import { recordingSignals } from './recording-signals.js';
import { refitColumns } from './refit.js';
import { columnsAndRightSide } from './regression-system.js';
import type { TermSymbols } from './term-symbols.js';

/** Independent noise draws averaged for one estimate: with 3 the estimate still varied by a third between seeds. */
const DRAWS = 8;

/**
 * How far noise of the size the recordings carry moves a model's fitted coefficients. Fresh noise of the size
 * estimated on every measured channel (noise-floor.ts) is added to the recordings again, the model's columns
 * are rebuilt from the new signals and re-fitted, and each coefficient's change relative to its value is
 * measured (rms over the draws), per fitted term. Noise in the columns of a least-squares fit (errors in variables) biases it by
 * an amount that grows with the noise variance, so adding the variance once more moves the coefficients by
 * about the error the noise already present causes: the idea behind simulation-extrapolation (Cook & Stefanski,
 * 1994; from memory). A figure of the coefficients, where the noise shares of the signals are only a proxy.
 */
export function coefficientNoise(
  terms: readonly CandidateTerm[],
  coefficients: readonly number[],
  reference: CandidateTerm | null,
  recordings: readonly Recording[],
  settings: SweepSettings,
  symbols: TermSymbols,
  needAccelerations: boolean,
  normal: () => number,
): CoefficientNoiseReport {
  const noise = recordings.map(channelNoise);
  const squares = terms.map(() => 0);
  for (let draw = 0; draw < DRAWS; draw++) {
    const signals = recordings.map((r, i) => recordingSignals(perturb(r, noise[i]!, normal), symbols, settings.derivatives, needAccelerations));
    const system = columnsAndRightSide(settings, signals, terms, reference);
    const refit = refitColumns(system.columns, system.rhs).coefficients;
    refit.forEach((c, j) => {
      const base = coefficients[j]!;
      squares[j] = squares[j]! + (base === 0 ? 0 : ((c - base) / base) ** 2);
    });
  }
  return { terms: terms.map((t) => t.text), shifts: squares.map((s) => Math.sqrt(s / DRAWS)) };
}

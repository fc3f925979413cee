import { windowStarts } from './balance-form.js';
import type { CandidateTerm } from './candidate-term.js';
import { DiscoveryInputError } from './discovery-input-error.js';
import type { RecordingSignals } from './recording-signals.js';
import { formRows, type FormSettings } from './regression-system.js';

/** An energy's energy-balance residual on one recording, one entry per row of the regression form. */
export interface EnergyBalanceResidual {
  /** The sample's time (derivative form) or the time at the end of the window (balance form). */
  time: Float64Array;
  /** sum_j c_j a_ij - p_i: the energy's rate (or change) less the input power (or its integral). */
  residual: Float64Array;
  /** p_i: the input power on the sample, or its integral over the window; zero on passive recordings. */
  power: Float64Array;
  /** sum_j |c_j a_ij|: how large the exchanges between the energy's parts are on the row. */
  parts: Float64Array;
}

/**
 * The residual of the energy balance dE/dt = P (method.md section 2) for the energy sum_j c_j theta_j on one
 * recording, in the rows the sweep regresses on: per sample Gamma c - P in the derivative form, per window
 * E(t_b) - E(t_a) - integral of P in the balance form. The rows come from the same formRows the discovery
 * uses, so this is the residual the sweep scored, recording by recording.
 */
export function energyBalanceResidual(
  settings: FormSettings,
  signals: RecordingSignals,
  terms: readonly CandidateTerm[],
  coefficients: readonly number[],
): EnergyBalanceResidual {
  if (terms.length !== coefficients.length) {
    throw new DiscoveryInputError(`The energy has ${terms.length} terms but ${coefficients.length} coefficients.`);
  }
  const rows = formRows(settings, [signals], terms);
  const time =
    settings.form === 'derivative'
      ? Float64Array.from(signals.time)
      : Float64Array.from(windowStarts(signals.length, settings.balance), (a) => signals.time[a + settings.balance.window]!);
  const power = rows.power ? Float64Array.from(rows.power) : new Float64Array(rows.rowCount);
  const residual = new Float64Array(rows.rowCount);
  const parts = new Float64Array(rows.rowCount);
  rows.columns.forEach((column, j) => {
    const c = coefficients[j]!;
    for (let i = 0; i < rows.rowCount; i++) {
      const part = c * column[i]!;
      residual[i] = residual[i]! + part;
      parts[i] = parts[i]! + Math.abs(part);
    }
  });
  for (let i = 0; i < rows.rowCount; i++) residual[i] = residual[i]! - power[i]!;
  return { time, residual, power, parts };
}

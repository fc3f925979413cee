import type { CandidateTerm } from './candidate-term.js';
import { concatenate, rootMeanSquare, type FormRows } from './form-rows.js';
import type { RecordingSignals } from './recording-signals.js';

/**
 * The derivative form (method.md section 2): one row per sample, the column of term j is
 * d theta_j/dt = sum_i (d theta_j/d q_i) dq_i + (d theta_j/d dq_i) ddq_i, the right side the power P. Rows
 * of several recordings are stacked; each recording brought its own derivative estimates.
 */
export function derivativeFormRows(signals: readonly RecordingSignals[], terms: readonly CandidateTerm[]): FormRows {
  const columns = terms.map((term) => concatenate(signals.map((s) => term.timeDerivative(s.samples))));
  const valueScales = terms.map((term) => rootMeanSquare(concatenate(signals.map((s) => term.value(s.samples)))));
  const anyPower = signals.some((s) => s.power !== null);
  const power = anyPower ? concatenate(signals.map((s) => s.power ?? new Float64Array(s.length))) : null;
  const durations = signals.map((s) => s.time[s.length - 1]! - s.time[0]!);
  return {
    rowCount: columns[0]?.length ?? signals.reduce((sum, s) => sum + s.length, 0),
    columns,
    power,
    valueScales,
    changeScale: durations.reduce((a, b) => a + b, 0) / Math.max(1, durations.length),
  };
}

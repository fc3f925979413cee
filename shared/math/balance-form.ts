import type { BalanceSettings } from '../schemas/sweep-description.js';
import type { CandidateTerm } from './candidate-term.js';
import { DiscoveryInputError } from './discovery-input-error.js';
import { concatenate, rootMeanSquare, type FormRows } from './form-rows.js';
import type { RecordingSignals } from './recording-signals.js';
import { windowIntegral } from './window-integral.js';

/** Start indices of the windows of one recording: window intervals long, every stride samples. */
export function windowStarts(length: number, settings: Pick<BalanceSettings, 'window' | 'stride'>): number[] {
  const starts: number[] = [];
  for (let a = 0; a + settings.window <= length - 1; a += settings.stride) starts.push(a);
  return starts;
}

/**
 * The balance (integral) form (method.md section 2): for each window [t_a, t_b] of a recording, the row of
 * term j is theta_j(t_b) - theta_j(t_a) and the right side the integral of the power over the window. No
 * acceleration is needed, and the integral averages noise instead of amplifying it. Windows never cross
 * from one recording into the next.
 */
export function balanceFormRows(
  signals: readonly RecordingSignals[],
  terms: readonly CandidateTerm[],
  settings: BalanceSettings,
): FormRows {
  for (const s of signals) {
    if (s.length - 1 < settings.window) {
      throw new DiscoveryInputError(
        `${s.name} has ${s.length} usable samples after derivative estimation, too few for a balance window ` +
          `of ${settings.window} intervals (${settings.window + 1} samples).`,
      );
    }
  }
  const starts = signals.map((s) => windowStarts(s.length, settings));
  const columns = terms.map((term) =>
    concatenate(
      signals.map((s, r) => {
        const values = term.value(s.samples);
        return Float64Array.from(starts[r]!, (a) => values[a + settings.window]! - values[a]!);
      }),
    ),
  );
  const valueScales = terms.map((term) => rootMeanSquare(concatenate(signals.map((s) => term.value(s.samples)))));
  const anyPower = signals.some((s) => s.power !== null);
  const power = anyPower
    ? concatenate(
        signals.map((s, r) => {
          const p = s.power;
          return Float64Array.from(starts[r]!, (a) =>
            p ? windowIntegral(s.time, p, a, a + settings.window, settings.integration) : 0,
          );
        }),
      )
    : null;
  return {
    rowCount: starts.reduce((sum, list) => sum + list.length, 0),
    columns,
    power,
    valueScales,
    changeScale: 1,
  };
}

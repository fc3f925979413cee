import type { DerivativeSettings } from '../schemas/sweep-description.js';
import type { Recording } from './recording.js';
import { recordingSignals } from './recording-signals.js';
import { TermSymbols } from './term-symbols.js';

/** The states (q, dq) of a recording on the samples where every velocity is known. */
export interface RecordingStates {
  name: string;
  /** Index in the recording of the first state (the estimator trims the edges). */
  start: number;
  time: Float64Array;
  /** Per coordinate: positions (the estimator's, as the discovery uses them) and velocities. */
  q: Float64Array[];
  dq: Float64Array[];
}

/**
 * Positions and velocities of one recording as the discovery sees them (recording-signals.ts): a measured
 * velocity where the recording has one, else the estimator's derivative, on the samples where every estimate
 * is valid. Throws DiscoveryInputError naming the recording when it is too short for the estimator.
 */
export function recordingStates(recording: Recording, coordinates: readonly string[], settings: DerivativeSettings): RecordingStates {
  const symbols = new TermSymbols(coordinates);
  const signals = recordingSignals(recording, symbols, settings, false);
  const start = recording.time.indexOf(signals.time[0]!);
  return {
    name: recording.name,
    start,
    time: signals.time,
    q: coordinates.map((c) => signals.samples.column(c)),
    dq: symbols.velocities.map((v) => signals.samples.column(v)),
  };
}

import type { DerivativeSettings } from '../schemas/sweep-description.js';
import { centralDifferences } from './central-difference.js';
import { checkSavitzkyGolaySettings, savitzkyGolayDerivatives } from './savitzky-golay.js';

export type { DerivativeSettings };

/** Estimates over one recording. Arrays have the recording's length; only indices [start, end) are valid (NaN elsewhere). */
export interface DerivativeEstimate {
  start: number;
  end: number;
  /** The position the derivatives belong to: smoothed by Savitzky-Golay, unchanged by central differences. */
  position: Float64Array;
  velocity: Float64Array;
  acceleration: Float64Array;
}

/** Samples lost at each edge of a recording by the estimator. */
export function derivativeTrim(settings: DerivativeSettings): number {
  if (settings.method === 'central') return 1;
  checkSavitzkyGolaySettings(settings.window, settings.order);
  return (settings.window - 1) / 2;
}

/**
 * Velocity and acceleration (and the matching position) from positions sampled at the given times, for ONE
 * recording: never pass two recordings joined together, or the estimate would straddle the seam.
 */
export function estimateDerivatives(time: Float64Array, position: Float64Array, settings: DerivativeSettings): DerivativeEstimate {
  if (settings.method === 'central') return centralDifferences(time, position);
  return savitzkyGolayDerivatives(time, position, settings.window, settings.order);
}

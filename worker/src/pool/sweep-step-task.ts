import type { Recording } from '../../../shared/math/recording.js';
import type { SweepSettings } from '../../../shared/schemas/sweep-description.js';
import { finishSweep, prepareSweep } from '../../../shared/sweeps/prepared-sweep.js';
import type { StoredLeaderboard } from '../../../shared/sweeps/stored-leaderboard.js';

export type SweepStepInput =
  | { step: 'prepare'; settings: SweepSettings; recordings: Recording[] }
  | {
      step: 'finish';
      settings: SweepSettings;
      recordings: Recording[];
      board: StoredLeaderboard;
      counts: { evaluated: number; rejected: number };
      seconds: number;
    };

/** Thread entry: the prepare or finish step of a sweep, off the worker's main thread. */
export default function runSweepStep(input: SweepStepInput) {
  return input.step === 'prepare'
    ? prepareSweep(input.settings, input.recordings)
    : finishSweep(input.settings, input.recordings, input.board, input.counts, input.seconds);
}

import { Piscina } from 'piscina';
import type { Recording } from '../../../shared/math/recording.js';
import type { DiscoveryResult } from '../../../shared/schemas/discovery-result.js';
import type { SweepSettings } from '../../../shared/schemas/sweep-description.js';
import type { PreparedSweep, StepAnswer } from '../../../shared/sweeps/prepared-sweep.js';
import type { StoredLeaderboard } from '../../../shared/sweeps/stored-leaderboard.js';
import type { SweepStepInput } from './sweep-step-task.js';

const isTypeScript = import.meta.url.endsWith('.ts');
const taskFile = new URL(`./sweep-step-task.${isTypeScript ? 'ts' : 'js'}`, import.meta.url).href;

/**
 * One thread for the prepare and finish steps. They read whole recordings and can take seconds; on the main
 * thread they would hold up the progress ticks (and with them the cancel checks) of the shards running here.
 */
export class SweepStepPool {
  private readonly piscina = new Piscina({ filename: taskFile, minThreads: 0, maxThreads: 1, idleTimeout: 60_000 });

  prepare(settings: SweepSettings, recordings: Recording[]): Promise<StepAnswer<PreparedSweep>> {
    const input: SweepStepInput = { step: 'prepare', settings, recordings };
    return this.piscina.run(input);
  }

  finish(
    settings: SweepSettings,
    recordings: Recording[],
    board: StoredLeaderboard,
    counts: { evaluated: number; rejected: number },
    seconds: number,
  ): Promise<StepAnswer<DiscoveryResult>> {
    const input: SweepStepInput = { step: 'finish', settings, recordings, board, counts, seconds };
    return this.piscina.run(input);
  }

  destroy(): Promise<void> {
    return this.piscina.destroy();
  }
}

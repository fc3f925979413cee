import os from 'node:os';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { partitionSlices } from '../../../shared/math/combinations.js';
import { mergeSweepOutcomes } from '../../../shared/math/leaderboard.js';
import type { GramProblem, SweepOutcome, SweepProgress, SweepSlice } from '../../../shared/math/sweep-problem.js';
import type { MeasuredSweep, SweepTaskInput, SweepTaskOptions } from './sweep-task.js';

export interface SweepPoolOptions {
  /** Worker threads (default: os.availableParallelism()). */
  threads?: number;
  /** How long an idle thread is kept, in milliseconds (default 30 s). */
  idleTimeoutMs?: number;
}

export interface SweepRunOptions extends SweepTaskOptions {
  /** Shared flag from createStopFlag(); requestStop(flag) ends the run with partial results. */
  stopFlag?: Int32Array;
  /** Running totals of the whole run, at most about every progressIntervalMs per thread. */
  onProgress?: (progress: SweepProgress) => void;
  progressIntervalMs?: number;
}

export interface SweepAcrossThreadsOptions extends SweepRunOptions {
  /** Tasks per thread, so that a thread that finishes early takes more work (default 4). */
  tasksPerThread?: number;
}

/** A stop flag that can be shared with sweep threads. */
export function createStopFlag(): Int32Array {
  return new Int32Array(new SharedArrayBuffer(4));
}

export function requestStop(flag: Int32Array): void {
  Atomics.store(flag, 0, 1);
}

const isTypeScript = import.meta.url.endsWith('.ts');
const taskFile = new URL(`./sweep-task.${isTypeScript ? 'ts' : 'js'}`, import.meta.url).href;

/** Worker threads that run the sweep kernel over lists of slices. */
export class SweepPool {
  readonly threads: number;
  private readonly piscina: Piscina;

  constructor(options: SweepPoolOptions = {}) {
    const threads = options.threads ?? os.availableParallelism();
    if (!Number.isInteger(threads) || threads < 1) throw new RangeError(`threads must be a whole number of at least 1, got ${threads}`);
    this.threads = threads;
    this.piscina = new Piscina({
      filename: taskFile,
      minThreads: threads,
      maxThreads: threads,
      idleTimeout: options.idleTimeoutMs ?? 30_000,
    });
  }

  /** Runs a list of slices on one thread; also says how much CPU time the thread spent on them. */
  runSlices(problem: GramProblem, slices: SweepSlice[], options: SweepRunOptions): Promise<MeasuredSweep> {
    return this.runTask(problem, slices, options, options.onProgress);
  }

  /** Splits the slices across all threads, runs them and merges the outcomes. */
  async sweepAcrossThreads(problem: GramProblem, slices: SweepSlice[], options: SweepAcrossThreadsOptions): Promise<SweepOutcome> {
    const groups = partitionSlices(slices, this.threads * (options.tasksPerThread ?? 4));
    const progressByTask = groups.map((): SweepProgress => ({ evaluated: 0, rejected: 0 }));
    const reportTotal = options.onProgress
      ? (task: number, progress: SweepProgress) => {
          progressByTask[task] = progress;
          options.onProgress!(sumProgress(progressByTask));
        }
      : undefined;
    const measured = await Promise.all(
      groups.map((group, task) =>
        this.runTask(problem, group, options, reportTotal && ((progress) => reportTotal(task, progress))),
      ),
    );
    return mergeSweepOutcomes(
      measured.map((m) => m.outcome),
      options.top,
    );
  }

  destroy(): Promise<void> {
    return this.piscina.destroy();
  }

  private async runTask(
    problem: GramProblem,
    slices: SweepSlice[],
    options: SweepRunOptions,
    onProgress: ((progress: SweepProgress) => void) | undefined,
  ): Promise<MeasuredSweep> {
    // Copies, so that moving them to the thread leaves the caller's arrays intact.
    const gram = problem.gram.slice();
    const rhs = problem.rhs.slice();
    const input: SweepTaskInput = {
      problem: { ...problem, gram, rhs },
      slices,
      options: { top: options.top, pivotTolerance: options.pivotTolerance, checkpointMs: options.checkpointMs },
      stopFlag: options.stopFlag,
      progressIntervalMs: options.progressIntervalMs,
    };
    const transferList: ArrayBuffer[] = [gram.buffer, rhs.buffer];
    if (!onProgress) return this.piscina.run(input, { transferList });
    const { port1, port2 } = new MessageChannel();
    port1.on('message', (progress: SweepProgress) => onProgress(progress));
    let measured: MeasuredSweep;
    try {
      measured = await this.piscina.run({ ...input, progressPort: port2 }, { transferList: [...transferList, port2] });
    } finally {
      port1.close();
    }
    // The last message on the port may still be in flight; the outcome has the final counts.
    onProgress({ evaluated: measured.outcome.evaluated, rejected: measured.outcome.rejected });
    return measured;
  }
}

function sumProgress(parts: readonly SweepProgress[]): SweepProgress {
  let evaluated = 0;
  let rejected = 0;
  for (const part of parts) {
    evaluated += part.evaluated;
    rejected += part.rejected;
  }
  return { evaluated, rejected };
}

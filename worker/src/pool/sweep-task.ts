import type { MessagePort } from 'node:worker_threads';
import { evaluateSlices } from '../../../shared/math/sweep-kernel.js';
import type { GramProblem, SweepOutcome, SweepProgress, SweepSlice } from '../../../shared/math/sweep-problem.js';
import { threadCpuSeconds } from './thread-cpu-time.js';

/** The plain-data part of SweepOptions that can cross a thread boundary. */
export interface SweepTaskOptions {
  top: number;
  pivotTolerance?: number;
  checkpointMs?: number;
}

/** What one thread is given: slices of one problem, and optionally a stop flag and a port for progress. */
export interface SweepTaskInput {
  problem: GramProblem;
  slices: SweepSlice[];
  options: SweepTaskOptions;
  /** Element 0 set to non-zero (Atomics.store) asks the sweep to stop with partial results. */
  stopFlag?: Int32Array;
  /** Receives SweepProgress messages, at most every progressIntervalMs and once at the end. */
  progressPort?: MessagePort;
  progressIntervalMs?: number;
}

/** A task's outcome and the CPU seconds its thread spent on it. */
export interface MeasuredSweep {
  outcome: SweepOutcome;
  /** The thread's CPU time (thread-cpu-time.ts), or its wall time on the task where the system gives none. */
  cpuSeconds: number;
}

const DEFAULT_PROGRESS_INTERVAL_MS = 250;

/** Thread entry: runs the sweep kernel over the slices on this thread and returns its outcome and CPU time. */
export default function runSweepTask(input: SweepTaskInput): MeasuredSweep {
  const cpuAtStart = threadCpuSeconds();
  const wallAtStart = performance.now();
  const outcome = sweepSlices(input);
  const cpuAtEnd = cpuAtStart === null ? null : threadCpuSeconds();
  const cpuSeconds = cpuAtStart !== null && cpuAtEnd !== null ? cpuAtEnd - cpuAtStart : (performance.now() - wallAtStart) / 1000;
  return { outcome, cpuSeconds };
}

function sweepSlices(input: SweepTaskInput): SweepOutcome {
  const { problem, slices, options, stopFlag, progressPort } = input;
  const interval = input.progressIntervalMs ?? DEFAULT_PROGRESS_INTERVAL_MS;
  const isStopRequested = stopFlag ? () => Atomics.load(stopFlag, 0) !== 0 : () => false;
  let lastPost = performance.now();
  const postProgress = (progress: SweepProgress): void => {
    const now = performance.now();
    if (now - lastPost < interval) return;
    lastPost = now;
    progressPort?.postMessage(progress);
  };
  try {
    const outcome = isStopRequested()
      ? untouchedOutcome(slices)
      : evaluateSlices(problem, slices, {
          ...options,
          onProgress: progressPort ? postProgress : undefined,
          shouldStop: stopFlag ? isStopRequested : undefined,
        });
    progressPort?.postMessage({ evaluated: outcome.evaluated, rejected: outcome.rejected } satisfies SweepProgress);
    return outcome;
  } finally {
    progressPort?.close();
  }
}

/** The outcome of a task that was asked to stop before it began. */
function untouchedOutcome(slices: SweepSlice[]): SweepOutcome {
  const bestBySize: Record<number, never[]> = {};
  for (const slice of slices) bestBySize[slice.size] = [];
  return { evaluated: 0, rejected: 0, stopped: true, best: [], bestBySize, remaining: slices.filter((slice) => slice.endRank > slice.firstRank).map((slice) => ({ ...slice })) };
}

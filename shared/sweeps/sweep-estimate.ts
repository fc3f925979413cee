import { countSubsetsBySize } from '../math/combinations.js';
import type { AllowanceLimits, AllowanceRefusal } from '../schemas/allowance.js';
import type { SizeEstimate } from '../schemas/sweep.js';

/**
 * Built-in speed until finished shards have been measured: the kernel's inner step costs about size + 2
 * multiply-adds per subset (sweep-kernel.ts), and a thread does a few hundred million such steps a second
 * on a current core. 6e7 / (size + 2) subsets per CPU second (10 million at size 4) errs on the slow side of
 * what `npm run bench` measures, so first estimates are high rather than low.
 */
export const DEFAULT_STEPS_PER_CPU_SECOND = 6e7;

export function defaultSubsetsPerCpuSecond(size: number): number {
  return DEFAULT_STEPS_PER_CPU_SECOND / (size + 2);
}

/** Measured speed per size: subsets and CPU seconds of finished shards. */
export type MeasuredThroughput = ReadonlyMap<number, { subsets: number; cpuSeconds: number }>;

/** Measurements shorter than this are too noisy to trust. */
export const MIN_MEASURED_CPU_SECONDS = 0.5;

/** Subsets per CPU second for one size: measured when enough was measured, else the default. */
export function subsetsPerCpuSecond(size: number, measured: MeasuredThroughput): { rate: number; measured: boolean } {
  const entry = measured.get(size);
  if (entry && entry.cpuSeconds >= MIN_MEASURED_CPU_SECONDS && entry.subsets > 0) {
    return { rate: entry.subsets / entry.cpuSeconds, measured: true };
  }
  return { rate: defaultSubsetsPerCpuSecond(size), measured: false };
}

/** Subsets and expected CPU seconds per size for m' candidates in the size range. */
export function estimateBySize(candidateCount: number, sizes: { min: number; max: number }, measured: MeasuredThroughput): SizeEstimate[] {
  return countSubsetsBySize(candidateCount, sizes.min, sizes.max).map(({ size, count }) => {
    const { rate, measured: wasMeasured } = subsetsPerCpuSecond(size, measured);
    return { size, subsets: count, subsetsPerCpuSecond: rate, measured: wasMeasured, cpuSeconds: count / rate };
  });
}

/** Everything the allowance check needs to know about the team now and the sweep to launch. */
export interface AllowanceQuestion {
  limits: AllowanceLimits;
  cpuSecondsUsed: number;
  cpuSecondsReserved: number;
  sweepsActive: number;
  totalSubsets: number;
  cpuSeconds: number;
}

const whole = (value: number) => Math.round(value).toLocaleString('en-US');

/**
 * The limits a launch would break, each with a message that states the limit and the estimate. CPU seconds
 * count what this month's shards were charged plus what the team's queued and running sweeps are still
 * expected to use (their estimates less their charges), so two launches cannot both count on the same
 * remainder.
 */
export function allowanceRefusals(question: AllowanceQuestion): AllowanceRefusal[] {
  const { limits } = question;
  const refusals: AllowanceRefusal[] = [];
  if (question.totalSubsets > limits.subsetsPerSweep) {
    refusals.push({
      limit: 'subsetsPerSweep',
      message: `This sweep needs about ${whole(question.totalSubsets)} subsets; your team's limit is ${whole(limits.subsetsPerSweep)} subsets per sweep.`,
    });
  }
  if (question.sweepsActive + 1 > limits.sweepsAtOnce) {
    refusals.push({
      limit: 'sweepsAtOnce',
      message: `Your team already has ${question.sweepsActive} sweep(s) queued or running; its limit is ${limits.sweepsAtOnce} at once.`,
    });
  }
  const remaining = Math.max(0, limits.cpuSecondsPerMonth - question.cpuSecondsUsed - question.cpuSecondsReserved);
  if (question.cpuSeconds > remaining) {
    refusals.push({
      limit: 'cpuSecondsPerMonth',
      message:
        `This sweep needs about ${whole(Math.ceil(question.cpuSeconds))} CPU seconds; your team has ${whole(Math.floor(remaining))} of its ` +
        `${whole(limits.cpuSecondsPerMonth)} CPU seconds this month left (${whole(question.cpuSecondsUsed)} used, ` +
        `${whole(question.cpuSecondsReserved)} expected by sweeps queued or running).`,
    });
  }
  return refusals;
}

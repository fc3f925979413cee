import { countSubsetsBySize } from '../math/combinations.js';
import type { AllowanceLimits, AllowanceRefusal } from '../schemas/allowance.js';
import type { EstimateBasis, SizeEstimate } from '../schemas/sweep.js';

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

/** Measured speed per size: subsets and CPU seconds of finished shards, and how many shards measured it. */
export type MeasuredThroughput = ReadonlyMap<number, { subsets: number; cpuSeconds: number; shards?: number }>;

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

/** Sizes as people read a list of them: `size 4`, `sizes 1 and 2`, `sizes 1 to 4`, `sizes 1, 3 and 5`. */
function sizeList(sizes: readonly number[]): string {
  if (sizes.length === 1) return `size ${sizes[0]}`;
  const contiguous = sizes.every((s, i) => i === 0 || s === sizes[i - 1]! + 1);
  if (contiguous && sizes.length > 2) return `sizes ${sizes[0]} to ${sizes.at(-1)}`;
  return `sizes ${sizes.slice(0, -1).join(', ')} and ${sizes.at(-1)}`;
}

/**
 * What the CPU seconds of an estimate rest on: the speed measured on finished shards of this installation, the
 * built-in default where a size has not been measured yet, or both.
 */
export function speedBasis(perSize: readonly SizeEstimate[], measured: MeasuredThroughput): EstimateBasis {
  const measuredSizes = perSize.filter((s) => s.measured).map((s) => s.size);
  const defaultSizes = perSize.filter((s) => !s.measured).map((s) => s.size);
  const shards = Math.round(Math.max(0, ...measuredSizes.map((size) => measured.get(size)?.shards ?? 0)));
  const over = shards > 0 ? ` over the last ${shards === 1 ? 'shard' : `${shards} shards`}` : '';
  if (defaultSizes.length === 0 && measuredSizes.length > 0) {
    return { source: 'measured', samples: shards, text: `measured on this installation${over}` };
  }
  if (measuredSizes.length === 0) {
    const millions = (DEFAULT_STEPS_PER_CPU_SECOND / 1e6).toLocaleString('en-US');
    return { source: 'default', samples: 0, text: `default until measured (${millions} million / (size + 2) subsets per CPU second)` };
  }
  return {
    source: 'partly measured',
    samples: shards,
    text: `measured on this installation for ${sizeList(measuredSizes)}${over}; default for ${sizeList(defaultSizes)} until measured`,
  };
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

import os from 'node:os';
import { binomial, unrankSubset } from '../../../shared/math/combinations.js';
import { evaluateSlices } from '../../../shared/math/sweep-kernel.js';
import type { SweepOutcome, SweepSlice } from '../../../shared/math/sweep-problem.js';
import { SweepPool } from '../pool/sweep-pool.js';
import { buildBenchProblem } from './bench-problem.js';
import { createSeededRandom } from './seeded-random.js';
import { straightforwardRss } from './straightforward-rss.js';

/*
 * npm run --silent bench [-- --json]
 * Times the sweep kernel against solving every subset the straightforward way, on one problem built from a
 * fixed seed: N = 2000 rows, m = 60 candidates, every subset of 5 (5,461,512 of them).
 */

const ROWS = 2000;
const CANDIDATES = 60;
const SIZE = 5;
const SAMPLE = 20_000;
const KERNEL_REPEATS = 3;
const TOP = 20;

interface ThreadFigure {
  threads: number;
  perSecond: number;
  seconds: number;
  sameAsOneThread: boolean;
}

function log(message: string): void {
  process.stderr.write(`${message}\n`);
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

function sameLeaderboards(a: SweepOutcome, b: SweepOutcome): boolean {
  return JSON.stringify([a.best, a.evaluated, a.rejected]) === JSON.stringify([b.best, b.evaluated, b.rejected]);
}

async function main(): Promise<void> {
  const json = process.argv.includes('--json');
  log(`building the problem: ${ROWS} rows, ${CANDIDATES} candidates`);
  const bench = buildBenchProblem({ rowCount: ROWS, columnCount: CANDIDATES, seed: 20261201, trueMembers: [3, 17, 28, 41, 55], noise: 0.5 });
  const total = binomial(CANDIDATES, SIZE);
  const everything: SweepSlice[] = [{ size: SIZE, firstRank: 0, endRank: total }];

  log(`kernel, one thread, ${total} subsets x ${KERNEL_REPEATS}`);
  evaluateSlices(bench.problem, [{ size: SIZE, firstRank: 0, endRank: Math.min(total, 500_000) }], { top: TOP });
  const kernelSeconds: number[] = [];
  let kernelOutcome: SweepOutcome | undefined;
  for (let repeat = 0; repeat < KERNEL_REPEATS; repeat++) {
    const start = performance.now();
    kernelOutcome = evaluateSlices(bench.problem, everything, { top: TOP });
    kernelSeconds.push((performance.now() - start) / 1000);
  }
  const kernelPerSecond = total / median(kernelSeconds);

  log(`straightforward solve (ml-matrix QR on the ${ROWS} x ${SIZE} reduced matrix), ${SAMPLE} sampled subsets`);
  const uniform = createSeededRandom(7);
  const sampleRanks = Array.from({ length: SAMPLE }, () => Math.floor(uniform() * total));
  const straightRss = new Float64Array(SAMPLE);
  const straightStart = performance.now();
  for (let i = 0; i < SAMPLE; i++) {
    const members = unrankSubset(sampleRanks[i], CANDIDATES, SIZE);
    straightRss[i] = straightforwardRss(bench.columns, bench.y, members);
  }
  const straightSeconds = (performance.now() - straightStart) / 1000;
  const straightforwardPerSecond = SAMPLE / straightSeconds;

  log('sanity check: kernel RSS of each sampled subset against the straightforward RSS');
  let maxRelativeDifference = 0;
  for (let i = 0; i < SAMPLE; i++) {
    const single = evaluateSlices(bench.problem, [{ size: SIZE, firstRank: sampleRanks[i], endRank: sampleRanks[i] + 1 }], { top: 1 });
    const rss = single.best[0]?.rss ?? Number.NaN;
    const difference = Math.abs(rss - straightRss[i]) / Math.max(straightRss[i], Number.MIN_VALUE);
    maxRelativeDifference = Math.max(maxRelativeDifference, Number.isNaN(difference) ? Infinity : difference);
  }
  const bestMembers = kernelOutcome!.best[0]?.members ?? [];

  const threadCounts = [...new Set([1, 2, os.availableParallelism()])].sort((a, b) => a - b);
  const threads: ThreadFigure[] = [];
  for (const count of threadCounts) {
    log(`kernel on ${count} thread(s) through the pool`);
    const pool = new SweepPool({ threads: count });
    try {
      await pool.sweepAcrossThreads(bench.problem, [{ size: SIZE, firstRank: 0, endRank: Math.min(total, 200_000) }], { top: TOP });
      const seconds: number[] = [];
      let outcome: SweepOutcome | undefined;
      for (let repeat = 0; repeat < KERNEL_REPEATS; repeat++) {
        const start = performance.now();
        outcome = await pool.sweepAcrossThreads(bench.problem, everything, { top: TOP });
        seconds.push((performance.now() - start) / 1000);
      }
      const time = median(seconds);
      threads.push({ threads: count, perSecond: total / time, seconds: time, sameAsOneThread: sameLeaderboards(outcome!, kernelOutcome!) });
    } finally {
      await pool.destroy();
    }
  }

  const figures = {
    rows: ROWS,
    candidates: CANDIDATES,
    size: SIZE,
    subsets: total,
    kernelSeconds: median(kernelSeconds),
    kernelPerSecond,
    straightforwardSample: SAMPLE,
    straightforwardSeconds: straightSeconds,
    straightforwardPerSecond,
    ratio: kernelPerSecond / straightforwardPerSecond,
    maxRelativeRssDifference: maxRelativeDifference,
    bestMembers,
    trueMembers: bench.trueMembers,
    rejected: kernelOutcome!.rejected,
    threads,
    availableParallelism: os.availableParallelism(),
  };
  if (json) {
    process.stdout.write(`${JSON.stringify(figures)}\n`);
    return;
  }
  printTable(figures);
}

function printTable(f: {
  subsets: number;
  kernelSeconds: number;
  kernelPerSecond: number;
  straightforwardSample: number;
  straightforwardSeconds: number;
  straightforwardPerSecond: number;
  ratio: number;
  maxRelativeRssDifference: number;
  bestMembers: number[];
  trueMembers: number[];
  threads: ThreadFigure[];
}): void {
  const rate = (value: number) => `${(value / 1e6).toFixed(2)} M/s`;
  const lines = [
    `Sweep benchmark: N = ${ROWS} rows, m = ${CANDIDATES} candidates, size ${SIZE} (${f.subsets.toLocaleString('en')} subsets)`,
    '',
    `| what                                   | subsets    | seconds | subsets per second |`,
    `|----------------------------------------|------------|---------|--------------------|`,
    `| kernel, 1 thread (median of ${KERNEL_REPEATS})          | ${pad(f.subsets, 10)} | ${f.kernelSeconds.toFixed(3).padStart(7)} | ${rate(f.kernelPerSecond).padStart(18)} |`,
    `| straightforward (ml-matrix QR), sample | ${pad(f.straightforwardSample, 10)} | ${f.straightforwardSeconds.toFixed(3).padStart(7)} | ${f.straightforwardPerSecond.toFixed(0).padStart(16)}/s |`,
    ...f.threads.map(
      (t) =>
        `| kernel via pool, ${String(t.threads).padEnd(2)} thread(s)          | ${pad(f.subsets, 10)} | ${t.seconds.toFixed(3).padStart(7)} | ${rate(t.perSecond).padStart(18)} |`,
    ),
    '',
    `speed-up of the kernel over the straightforward solve: ${f.ratio.toFixed(0)}x`,
    `scaling: ${f.threads.map((t) => `${t.threads} thread(s) ${(t.perSecond / f.threads[0].perSecond).toFixed(2)}x`).join(', ')}`,
    `pool outcomes equal to the one-thread kernel: ${f.threads.every((t) => t.sameAsOneThread) ? 'yes' : 'NO'}`,
    `sanity: largest relative RSS difference kernel vs straightforward on ${f.straightforwardSample} subsets: ${f.maxRelativeRssDifference.toExponential(2)}`,
    `best subset found: [${f.bestMembers.join(', ')}], y was built from [${f.trueMembers.join(', ')}]`,
  ];
  process.stdout.write(`${lines.join('\n')}\n`);
}

function pad(value: number, width: number): string {
  return String(value).padStart(width);
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? error.stack : String(error)}\n`);
  process.exit(1);
});

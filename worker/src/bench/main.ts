import os from 'node:os';
import { binomial, unrankSubset } from '../../../shared/math/combinations.js';
import { evaluateSlices } from '../../../shared/math/sweep-kernel.js';
import type { SweepOutcome, SweepSlice } from '../../../shared/math/sweep-problem.js';
import { SweepPool } from '../pool/sweep-pool.js';
import { buildBenchProblem } from './bench-problem.js';
import { createSeededRandom } from '../../../shared/math/seeded-random.js';
import { straightforwardRss } from './straightforward-rss.js';

/*
 * npm run --silent bench [-- --json] [-- --sample 20000]
 * Times the sweep kernel against solving every subset the straightforward way, on one problem built from a
 * fixed seed: N = 2000 rows, m = 60 candidates, every subset of 5 (5,461,512 of them).
 */

const ROWS = 2000;
const CANDIDATES = 60;
const SIZE = 5;
const DEFAULT_SAMPLE = 20_000;
const KERNEL_REPEATS = 5;
const TOP = 20;

interface TimedRuns {
  medianSeconds: number;
  bestSeconds: number;
  /** CPU time of all threads of this process over wall time: below the thread count when others ran too. */
  coresUsed: number;
  outcome: SweepOutcome;
}

interface ThreadFigure {
  threads: number;
  /** From the median run. */
  perSecond: number;
  /** From the fastest run (the machine is shared, so the spread says how much others were running). */
  bestPerSecond: number;
  seconds: number;
  coresUsed: number;
  sameAsOneThread: boolean;
}

function log(message: string): void {
  process.stderr.write(`${message}\n`);
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

/** One warm-up run (so that the optimizing compiler has seen the kernel on every thread), then timed runs. */
async function timeRuns(run: () => SweepOutcome | Promise<SweepOutcome>): Promise<TimedRuns> {
  let outcome = await run();
  const seconds: number[] = [];
  const cpuBefore = process.cpuUsage();
  for (let repeat = 0; repeat < KERNEL_REPEATS; repeat++) {
    const start = performance.now();
    outcome = await run();
    seconds.push((performance.now() - start) / 1000);
  }
  const cpu = process.cpuUsage(cpuBefore);
  const coresUsed = (cpu.user + cpu.system) / 1e6 / seconds.reduce((sum, value) => sum + value, 0);
  return { medianSeconds: median(seconds), bestSeconds: Math.min(...seconds), coresUsed, outcome };
}

function sampleSizeFromArguments(): number {
  const index = process.argv.indexOf('--sample');
  if (index < 0) return DEFAULT_SAMPLE;
  const value = Number(process.argv[index + 1]);
  if (!Number.isInteger(value) || value < 1) throw new Error(`--sample needs a whole number of subsets, got ${process.argv[index + 1]}`);
  return value;
}

function sameLeaderboards(a: SweepOutcome, b: SweepOutcome): boolean {
  return JSON.stringify([a.best, a.evaluated, a.rejected]) === JSON.stringify([b.best, b.evaluated, b.rejected]);
}

async function main(): Promise<void> {
  const json = process.argv.includes('--json');
  const sample = sampleSizeFromArguments();
  // Other programs on the machine slow the figures down, the threaded ones most: say how busy it was.
  const loadAtStart = os.loadavg()[0];
  log(`building the problem: ${ROWS} rows, ${CANDIDATES} candidates`);
  const bench = buildBenchProblem({ rowCount: ROWS, columnCount: CANDIDATES, seed: 20261201, trueMembers: [3, 17, 28, 41, 55], noise: 0.5 });
  const total = binomial(CANDIDATES, SIZE);
  const everything: SweepSlice[] = [{ size: SIZE, firstRank: 0, endRank: total }];

  log(`kernel, one thread, ${total} subsets: one warm-up run, then ${KERNEL_REPEATS} timed runs`);
  const kernel = await timeRuns(() => evaluateSlices(bench.problem, everything, { top: TOP }));
  const kernelOutcome = kernel.outcome;
  const kernelPerSecond = total / kernel.medianSeconds;

  log(`straightforward solve (ml-matrix QR on the ${ROWS} x ${SIZE} reduced matrix), ${sample} sampled subsets`);
  const uniform = createSeededRandom(7);
  const sampleRanks = Array.from({ length: sample }, () => Math.floor(uniform() * total));
  const straightRss = new Float64Array(sample);
  const straightStart = performance.now();
  for (let i = 0; i < sample; i++) {
    const members = unrankSubset(sampleRanks[i], CANDIDATES, SIZE);
    straightRss[i] = straightforwardRss(bench.columns, bench.y, members);
  }
  const straightSeconds = (performance.now() - straightStart) / 1000;
  const straightforwardPerSecond = sample / straightSeconds;

  log('sanity check: kernel RSS of each sampled subset against the straightforward RSS');
  let maxRelativeDifference = 0;
  for (let i = 0; i < sample; i++) {
    const single = evaluateSlices(bench.problem, [{ size: SIZE, firstRank: sampleRanks[i], endRank: sampleRanks[i] + 1 }], { top: 1 });
    const rss = single.best[0]?.rss ?? Number.NaN;
    const difference = Math.abs(rss - straightRss[i]) / Math.max(straightRss[i], Number.MIN_VALUE);
    maxRelativeDifference = Math.max(maxRelativeDifference, Number.isNaN(difference) ? Infinity : difference);
  }
  const bestMembers = kernelOutcome.best[0]?.members ?? [];

  const threadCounts = [...new Set([1, 2, os.availableParallelism()])].sort((a, b) => a - b);
  const threads: ThreadFigure[] = [];
  for (const count of threadCounts) {
    log(`kernel on ${count} thread(s) through the pool`);
    const pool = new SweepPool({ threads: count });
    try {
      const run = await timeRuns(() => pool.sweepAcrossThreads(bench.problem, everything, { top: TOP }));
      threads.push({
        threads: count,
        perSecond: total / run.medianSeconds,
        bestPerSecond: total / run.bestSeconds,
        seconds: run.medianSeconds,
        coresUsed: run.coresUsed,
        sameAsOneThread: sameLeaderboards(run.outcome, kernelOutcome),
      });
    } finally {
      await pool.destroy();
    }
  }

  const figures: Figures & Record<string, unknown> = {
    rows: ROWS,
    candidates: CANDIDATES,
    size: SIZE,
    subsets: total,
    kernelSeconds: kernel.medianSeconds,
    kernelPerSecond,
    kernelBestPerSecond: total / kernel.bestSeconds,
    kernelCoresUsed: kernel.coresUsed,
    straightforwardSample: sample,
    straightforwardSeconds: straightSeconds,
    straightforwardPerSecond,
    ratio: kernelPerSecond / straightforwardPerSecond,
    maxRelativeRssDifference: maxRelativeDifference,
    bestMembers,
    trueMembers: bench.trueMembers,
    rejected: kernelOutcome.rejected,
    threads,
    availableParallelism: os.availableParallelism(),
    loadAverage: { atStart: loadAtStart, atEnd: os.loadavg()[0] },
  };
  if (json) {
    process.stdout.write(`${JSON.stringify(figures)}\n`);
    return;
  }
  printTable(figures);
}

type Figures = {
  subsets: number;
  kernelSeconds: number;
  kernelPerSecond: number;
  kernelBestPerSecond: number;
  kernelCoresUsed: number;
  straightforwardSample: number;
  straightforwardSeconds: number;
  straightforwardPerSecond: number;
  ratio: number;
  maxRelativeRssDifference: number;
  bestMembers: number[];
  trueMembers: number[];
  threads: ThreadFigure[];
  availableParallelism: number;
  loadAverage: { atStart: number; atEnd: number };
};

function printTable(f: Figures): void {
  const rate = (value: number) => (value >= 1e5 ? `${(value / 1e6).toFixed(2)} M/s` : `${value.toFixed(0)} /s`);
  const rows = [
    ['what', 'subsets', 'seconds', 'per second', 'fastest run', 'cores used', 'per CPU-second'],
    [`kernel, 1 thread (median of ${KERNEL_REPEATS})`, String(f.subsets), f.kernelSeconds.toFixed(3), rate(f.kernelPerSecond), rate(f.kernelBestPerSecond), f.kernelCoresUsed.toFixed(2), rate(f.kernelPerSecond / f.kernelCoresUsed)],
    ['straightforward, ml-matrix QR (sample)', String(f.straightforwardSample), f.straightforwardSeconds.toFixed(3), rate(f.straightforwardPerSecond), '', '', ''],
    ...f.threads.map((t) => [
      `kernel via pool, ${t.threads} thread(s) (median of ${KERNEL_REPEATS})`,
      String(f.subsets),
      t.seconds.toFixed(3),
      rate(t.perSecond),
      rate(t.bestPerSecond),
      t.coresUsed.toFixed(2),
      rate(t.perSecond / t.coresUsed),
    ]),
  ];
  const widths = rows[0].map((_, column) => Math.max(...rows.map((row) => row[column].length)));
  const line = (row: string[]) => `| ${row.map((cell, column) => (column === 0 ? cell.padEnd(widths[column]) : cell.padStart(widths[column]))).join(' | ')} |`;
  const lines = [
    `Sweep benchmark: N = ${ROWS} rows, m = ${CANDIDATES} candidates, size ${SIZE} (${f.subsets.toLocaleString('en')} subsets)`,
    '',
    line(rows[0]),
    `|${widths.map((width) => '-'.repeat(width + 2)).join('|')}|`,
    ...rows.slice(1).map(line),
    '',
    `speed-up of the kernel over the straightforward solve: ${f.ratio.toFixed(0)}x`,
    `scaling: ${f.threads.map((t) => `${t.threads} thread(s) ${(t.perSecond / f.threads[0].perSecond).toFixed(2)}x`).join(', ')}`,
    `pool outcomes equal to the one-thread kernel: ${f.threads.every((t) => t.sameAsOneThread) ? 'yes' : 'NO'}`,
    `sanity: largest relative RSS difference, kernel vs straightforward, over ${f.straightforwardSample} subsets: ${f.maxRelativeRssDifference.toExponential(2)}`,
    `best subset found: [${f.bestMembers.join(', ')}]; y was built from [${f.trueMembers.join(', ')}]`,
    `machine: ${f.availableParallelism} cores; 1-minute load average ${f.loadAverage.atStart.toFixed(2)} at start, ${f.loadAverage.atEnd.toFixed(2)} at end`,
  ];
  process.stdout.write(`${lines.join('\n')}\n`);
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? error.stack : String(error)}\n`);
  process.exit(1);
});

import { expect } from 'chai';
import { countSliceSubsets, countSubsets, splitRankSpace } from '../../../shared/math/combinations.js';
import { buildGramProblem } from '../../../shared/math/gram-problem.js';
import { evaluateSlices } from '../../../shared/math/sweep-kernel.js';
import type { GramProblem, SweepProgress } from '../../../shared/math/sweep-problem.js';
import { createNormalRandom, createSeededRandom } from '../../../shared/math/seeded-random.js';
import { createStopFlag, requestStop, SweepPool } from '../../../worker/src/pool/sweep-pool.js';

function randomProblem(seed: number, rows: number, columnCount: number, knownCount: number): GramProblem {
  const normal = createNormalRandom(createSeededRandom(seed));
  const columns = Array.from({ length: columnCount }, () => Float64Array.from({ length: rows }, () => normal()));
  const y = Float64Array.from({ length: rows }, (_, r) => 2 * columns[3][r] - columns[8][r] + 0.5 * normal());
  return buildGramProblem(columns, y, knownCount).problem;
}

describe('sweep pool: the kernel on worker threads', () => {
  let pool: SweepPool;
  const problem = randomProblem(31, 50, 26, 1);
  const slices = splitRankSpace(25, 0, 4, 3000);
  const total = countSubsets(25, 0, 4);
  const options = { top: 15 };

  before(() => {
    pool = new SweepPool({ threads: 2 });
  });

  after(async () => {
    await pool.destroy();
  });

  it('gives on 2 threads the same outcome as the kernel on this thread', async () => {
    const here = evaluateSlices(problem, slices, options);
    const threaded = await pool.sweepAcrossThreads(problem, slices, options);
    expect(threaded.evaluated + threaded.rejected).to.equal(total);
    expect(threaded.evaluated).to.equal(here.evaluated);
    expect(threaded.rejected).to.equal(here.rejected);
    expect(threaded.best).to.deep.equal(here.best);
    expect(threaded.bestBySize).to.deep.equal(here.bestBySize);
    expect(threaded.stopped).to.equal(false);
    expect(threaded.remaining).to.deep.equal([]);
  });

  it('runs a list of slices on one thread and leaves the caller\'s arrays usable', async () => {
    const { outcome } = await pool.runSlices(problem, slices.slice(0, 3), options);
    expect(outcome.best).to.deep.equal(evaluateSlices(problem, slices.slice(0, 3), options).best);
    expect(problem.gram.length).to.equal(26 * 26);
    expect(problem.rhs.length).to.equal(26);
  });

  it('says how much CPU time the thread spent: more than nothing, no more than the time it took', async () => {
    const started = performance.now();
    const { cpuSeconds } = await pool.runSlices(problem, slices, options);
    const wall = (performance.now() - started) / 1000;
    expect(cpuSeconds).to.be.greaterThan(0);
    expect(cpuSeconds).to.be.at.most(wall + 0.01);
  });

  it('reports summed progress from the threads, ending at the totals', async () => {
    const reports: SweepProgress[] = [];
    const outcome = await pool.sweepAcrossThreads(problem, slices, { ...options, onProgress: (p) => reports.push(p) });
    expect(reports.length).to.be.greaterThan(0);
    expect(reports.at(-1)).to.deep.equal({ evaluated: outcome.evaluated, rejected: outcome.rejected });
  });

  it('stops through the shared flag and returns what is left to do', async () => {
    const stopFlag = createStopFlag();
    requestStop(stopFlag);
    const outcome = await pool.sweepAcrossThreads(problem, slices, { ...options, stopFlag });
    expect(outcome.stopped).to.equal(true);
    expect(outcome.evaluated + outcome.rejected).to.equal(0);
    const rest = await pool.sweepAcrossThreads(problem, outcome.remaining ?? [], options);
    expect(rest.best).to.deep.equal(evaluateSlices(problem, slices, options).best);
  });

  it('stops running threads through the shared flag with partial results', async () => {
    const large = randomProblem(32, 80, 60, 0);
    const largeSlices = splitRankSpace(60, 5, 5, 1e9);
    const stopFlag = createStopFlag();
    const outcome = await pool.sweepAcrossThreads(large, largeSlices, {
      top: 5,
      stopFlag,
      checkpointMs: 0,
      progressIntervalMs: 0,
      onProgress: () => requestStop(stopFlag),
    });
    expect(outcome.stopped).to.equal(true);
    const done = outcome.evaluated + outcome.rejected;
    expect(done).to.be.below(countSubsets(60, 5, 5));
    expect(done + countSliceSubsets(outcome.remaining ?? [])).to.equal(countSubsets(60, 5, 5));
  });
});

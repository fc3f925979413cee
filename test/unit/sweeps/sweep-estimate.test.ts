import { expect } from 'chai';
import { DEFAULT_FIXED_COSTS, expectedFixedCosts, expectedWallSeconds, shardOverheadOf } from '../../../shared/sweeps/fixed-costs.js';
import { planShards } from '../../../shared/sweeps/shard-plan.js';
import { defaultSubsetsPerCpuSecond, estimateBySize, speedBasis, type MeasuredThroughput } from '../../../shared/sweeps/sweep-estimate.js';

// The expected values are the estimate's formulas (README, "Estimates") worked by hand; subset counts are
// binomial coefficients (Knuth, TAOCP 4A, 7.2.1.3).
describe('the estimate of a sweep (CPU seconds, shards, wall time)', () => {
  const costs = { prepareSeconds: 1.5, shardOverheadSeconds: 0.5, finishSeconds: 0.75 };

  it('spreads the shards, CPU seconds plus handling each, over the threads, between prepare and finish', () => {
    // 1.5 + (3 + 7 x 0.5) / 1 + 0.75 = 8.75
    expect(expectedWallSeconds({ cpuSeconds: 3, shardCount: 7, threads: 1 }, costs)).to.be.closeTo(8.75, 1e-12);
    // 1.5 + 6.5 / 4 + 0.75 = 3.875
    expect(expectedWallSeconds({ cpuSeconds: 3, shardCount: 7, threads: 4 }, costs)).to.be.closeTo(3.875, 1e-12);
    // Sixteen threads, seven shards: seven work at once. 1.5 + 6.5 / 7 + 0.75
    expect(expectedWallSeconds({ cpuSeconds: 3, shardCount: 7, threads: 16 }, costs)).to.be.closeTo(2.25 + 6.5 / 7, 1e-12);
    expect(expectedWallSeconds({ cpuSeconds: 3, shardCount: 7, threads: 0 }, costs)).to.equal(null);
  });

  it('measures the handling of a shard from a finished sweep, and gives that sweep its own time back', () => {
    // Seven shards on one thread for 4 s, 0.5 s of it charged: (4 x 1 - 0.5) / 7 = 0.5 s each.
    expect(shardOverheadOf({ phaseSeconds: 4, cpuSeconds: 0.5, shardCount: 7, threads: 1 })).to.be.closeTo(0.5, 1e-12);
    // Two threads: (4 x 2 - 0.5) / 7. Ten threads but three shards: three at once, (4 x 3 - 0.5) / 3.
    expect(shardOverheadOf({ phaseSeconds: 4, cpuSeconds: 0.5, shardCount: 7, threads: 2 })).to.be.closeTo(7.5 / 7, 1e-12);
    expect(shardOverheadOf({ phaseSeconds: 4, cpuSeconds: 0.5, shardCount: 3, threads: 10 })).to.be.closeTo(11.5 / 3, 1e-12);
    expect(shardOverheadOf({ phaseSeconds: 1, cpuSeconds: 5, shardCount: 2, threads: 1 })).to.equal(0);
    const run = { phaseSeconds: 6.2, cpuSeconds: 1.3, shardCount: 9, threads: 2 };
    const measured = { prepareSeconds: 1.1, shardOverheadSeconds: shardOverheadOf(run), finishSeconds: 0.8 };
    expect(expectedWallSeconds({ cpuSeconds: run.cpuSeconds, shardCount: run.shardCount, threads: run.threads }, measured)).to.be.closeTo(1.1 + 6.2 + 0.8, 1e-12);
  });

  it('takes the medians of the latest finished sweeps, and says so; defaults until one has finished', () => {
    const none = expectedFixedCosts([]);
    expect(none.costs).to.deep.equal(DEFAULT_FIXED_COSTS);
    expect(none.basis).to.deep.include({ source: 'default', samples: 0 });
    expect(none.basis.text).to.match(/^default until measured/);
    const three = expectedFixedCosts([
      { prepareSeconds: 1, shardOverheadSeconds: 0.4, finishSeconds: 0.9 },
      { prepareSeconds: 60, shardOverheadSeconds: 0.5, finishSeconds: 0.7 },
      { prepareSeconds: 2, shardOverheadSeconds: 0.6, finishSeconds: 0.8 },
    ]);
    // A sweep that waited a minute for a worker does not move the median.
    expect(three.costs).to.deep.equal({ prepareSeconds: 2, shardOverheadSeconds: 0.5, finishSeconds: 0.8 });
    expect(three.basis).to.deep.equal({ source: 'measured', samples: 3, text: 'measured on this installation over the last 3 sweeps' });
    const four = expectedFixedCosts([1, 2, 3, 10].map((p) => ({ prepareSeconds: p, shardOverheadSeconds: p, finishSeconds: p })));
    expect(four.costs.prepareSeconds).to.equal(2.5);
  });

  it('counts subsets per size, and CPU seconds by the measured speed where there is one', () => {
    const measured: MeasuredThroughput = new Map([[1, { subsets: 2e6, cpuSeconds: 0.5, shards: 12.4 }], [2, { subsets: 3e6, cpuSeconds: 1, shards: 9 }]]);
    const perSize = estimateBySize(33, { min: 1, max: 3 }, measured);
    // C(33, 1) = 33, C(33, 2) = 528, C(33, 3) = 5456.
    expect(perSize.map((s) => s.subsets)).to.deep.equal([33, 528, 5456]);
    expect(perSize.map((s) => s.cpuSeconds)).to.deep.equal([33 / 4e6, 528 / 3e6, 5456 / defaultSubsetsPerCpuSecond(3)]);
    expect(speedBasis(perSize, measured)).to.deep.equal({
      source: 'partly measured',
      samples: 12,
      text: 'measured on this installation for sizes 1 and 2 over the last 12 shards; default for size 3 until measured',
    });
    expect(speedBasis(perSize.slice(0, 2), measured)).to.deep.equal({ source: 'measured', samples: 12, text: 'measured on this installation over the last 12 shards' });
    expect(speedBasis(estimateBySize(33, { min: 1, max: 2 }, new Map()), new Map()).source).to.equal('default');
  });

  it('plans as many shards as the prepare step will cut', () => {
    // 1,391,841 subsets (sizes 1 to 6 of 33) at 200,000 a shard: seven shards, as in the browser test.
    expect(planShards(33, { min: 1, max: 6 }, new Map(), { targetSeconds: 30, subsetsPerShard: 200_000 })).to.have.length(7);
  });
});

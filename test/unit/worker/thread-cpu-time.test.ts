import { expect } from 'chai';
import { threadCpuSeconds } from '../../../worker/src/pool/thread-cpu-time.js';

// What CPU time means (any operating systems text; from memory): time a thread spends running on a processor,
// not time it spends waiting. A busy loop uses about its wall time; a thread asleep on a timer uses next to none.
describe('thread CPU time (Linux per-thread scheduler statistics)', function () {
  before(function () {
    if (threadCpuSeconds() === null) this.skip(); // not Linux: the pool falls back to wall time there
  });

  it('grows by about the wall time while this thread computes', () => {
    const cpuBefore = threadCpuSeconds()!;
    const started = performance.now();
    let sink = 0;
    while (performance.now() - started < 200) sink += Math.sqrt(sink + 1);
    const wall = (performance.now() - started) / 1000;
    const used = threadCpuSeconds()! - cpuBefore;
    expect(sink).to.be.greaterThan(0);
    expect(used).to.be.at.most(wall + 0.02);
    expect(used, 'a busy loop gets most of a core even on a loaded machine').to.be.greaterThan(0.25 * wall);
  });

  it('hardly grows while this thread waits on a timer', async () => {
    const cpuBefore = threadCpuSeconds()!;
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(threadCpuSeconds()! - cpuBefore).to.be.below(0.05);
  });
});

import { expect } from 'chai';
import { rmSync } from 'node:fs';
import { sweepEstimateSchema } from '../../shared/schemas/sweep.js';
import { runModelSweep, type ModelSweep } from '../support/model-sweep.js';
import { generousAllowance, startTestApp, type TestApp } from '../support/test-app.js';
import { startTestWorker, type TestWorker } from '../support/worker-processes.js';

describe('the estimate of a sweep against the time it took', () => {
  let app: TestApp;
  let run: ModelSweep | undefined;
  let worker: TestWorker | undefined;

  before(async () => {
    app = await startTestApp({ allowanceDefaults: generousAllowance });
  });
  after(async () => {
    await worker?.stop();
    if (run) rmSync(run.folder, { recursive: true, force: true });
    await app?.close();
  });

  it('expects, once a sweep has finished, the same sweep to take within a factor of 3 of its wall time', async function () {
    this.timeout(240_000);
    // The cart-pole sweep of the model tests: 52,955 subsets in shards of 20,000 on one worker thread. Small
    // sweeps are where preparing, handling shards and finishing outweigh the subsets.
    run = await runModelSweep(app, 'Estimate lab', 'Estimated rig', { shardSubsets: 20_000 });
    const { sweep, analyst, projectId, launchBody } = run;
    const tookSeconds = (Date.parse(sweep.endedAt!) - Date.parse(sweep.launchedAt)) / 1000;

    // The same kind of worker is running again when the same sweep is estimated.
    worker = await startTestWorker({ threads: 1, shardSubsets: 20_000 });
    const response = await analyst.post(`/api/projects/${projectId}/sweeps/estimate`, launchBody);
    expect(response.status, await response.clone().text()).to.equal(200);
    const estimate = sweepEstimateSchema.parse(await response.json());
    console.log(
      `      took ${tookSeconds.toFixed(2)} s, estimated ${estimate.wallSeconds?.toFixed(2)} s ` +
        `(prepare ${estimate.fixedCosts.prepareSeconds.toFixed(2)} s, ${estimate.shardCount} shards at ${estimate.fixedCosts.shardOverheadSeconds.toFixed(2)} s ` +
        `+ ${estimate.cpuSeconds.toFixed(3)} CPU s, finish ${estimate.fixedCosts.finishSeconds.toFixed(2)} s; ${estimate.basis.fixedCosts.text}; speed ${estimate.basis.speed.text})`,
    );
    expect(estimate.shardCount).to.equal(sweep.shardCount);
    expect(estimate.workerThreads).to.equal(1);
    expect(estimate.basis.fixedCosts.source).to.equal('measured');
    expect(estimate.basis.fixedCosts.samples).to.be.at.least(1);
    expect(estimate.basis.fixedCosts.text).to.match(/^measured on this installation over the last (sweep|\d+ sweeps)$/);
    // A behaviour check, not a speed target: the estimate is of the same order as what the sweep took here.
    expect(estimate.wallSeconds).to.be.within(tookSeconds / 3, tookSeconds * 3);
  });
});

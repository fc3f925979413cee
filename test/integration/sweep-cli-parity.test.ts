import { expect } from 'chai';
import { rmSync } from 'node:fs';
import path from 'node:path';
import { discoveryResultSchema, type DiscoveryResult } from '../../shared/schemas/discovery-result.js';
import type { SweepRunSettingsInput } from '../../shared/schemas/sweep.js';
import { sweepLeaderboardSchema } from '../../shared/schemas/sweep-leaderboard.js';
import { cartPole } from '../support/mechanisms/handbook-mechanisms.js';
import { runModelSweep, type ModelSweep } from '../support/model-sweep.js';
import { runConserva } from '../support/run-cli.js';
import { cartPoleGenerator } from '../support/sweep-scenario.js';
import { generousAllowance, startTestApp, type TestApp } from '../support/test-app.js';
import { expectSameTerms } from '../unit/discovery/recovery-harness.js';

const settings: SweepRunSettingsInput = {
  sizes: { min: 1, max: 5 },
  form: 'balance',
  derivatives: { method: 'savitzky-golay', window: 9, order: 6 },
  top: 5,
};

describe('a sweep launched through the API agrees with the command line', () => {
  let app: TestApp;
  let run: ModelSweep | undefined;

  before(async () => {
    app = await startTestApp({ allowanceDefaults: generousAllowance });
  });
  after(async () => {
    if (run) rmSync(run.folder, { recursive: true, force: true });
    await app?.close();
  });

  it('finds the same best model, counts and ranking as `conserva discover` on the same files', async () => {
    // Two worker processes, shards of 400,000 subsets, 58 generated candidates (velocity degree 3), sizes 1 to 5.
    run = await runModelSweep(app, 'Parity lab', 'Cart-pole rig', {
      generator: cartPoleGenerator({ velocityDegree: 3 }),
      settings,
      workers: 2,
      shardSubsets: 400_000,
    });
    const { candidateSet, sweep, analyst, folder } = run;
    expect(candidateSet.candidateCount).to.equal(58);
    expect(sweep.shards.length).to.be.above(5);
    expect(sweep.shards.every((s) => s.state === 'done')).to.equal(true);
    const board = sweepLeaderboardSchema.parse(await (await analyst.get(`/api/sweeps/${sweep.id}/leaderboard`)).json());

    // The same sweep from the command line, on the description and CSV files runModelSweep wrote as a user would.
    const discovered = await runConserva(['discover', path.join(folder, 'description.json'), '--json'], { timeoutMs: 120_000 });
    expect(discovered.status, discovered.stderr).to.equal(0);
    const cli: DiscoveryResult = discoveryResultSchema.parse(JSON.parse(discovered.stdout));
    const service = board.result!;
    expect(service).to.not.equal(null);
    expect(service.evaluated).to.equal(cli.evaluated);
    expect(service.rejected).to.equal(cli.rejected);
    expect(sweep.evaluated + sweep.rejected).to.equal(sweep.totalSubsets);
    expect(service.best).to.deep.equal(cli.best);
    expect(service.models.map((m) => [m.terms, m.coefficients])).to.deep.equal(cli.models.map((m) => [m.terms, m.coefficients]));
    // Outside check: the best model is the handbook cart-pole energy (control textbooks' cart-pole).
    expectSameTerms(service.best!, cartPole.energyTerms, cartPole.coordinates, 1e-3);
    // The live leaderboard's best subset of each size is the finish step's front of error against size.
    expect(board.bySize.map((s) => [s.size, s.entries[0]!.terms])).to.deep.equal(cli.front.map((f) => [f.size, f.terms]));
  });
});

import { expect } from 'chai';
import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { discoveryResultSchema, type DiscoveryResult } from '../../shared/schemas/discovery-result.js';
import { sweepDetailSchema, type SweepDetail, type SweepRunSettingsInput } from '../../shared/schemas/sweep.js';
import { sweepLeaderboardSchema } from '../../shared/schemas/sweep-leaderboard.js';
import { cartPole } from '../support/mechanisms/handbook-mechanisms.js';
import { createTeamWithUsers, signIn, type TestAgent } from '../support/fixtures.js';
import {
  cartPoleCsv,
  cartPoleGenerator,
  cartPoleTrainingRuns,
  cartPoleValidationRun,
  createGeneratedCandidateSet,
  createProject,
  uploadRecording,
} from '../support/sweep-scenario.js';
import { generousAllowance, startTestApp, type TestApp } from '../support/test-app.js';
import { eventually, startTestWorker, type TestWorker } from '../support/worker-processes.js';
import { expectSameTerms } from '../unit/discovery/recovery-harness.js';

const root = path.resolve(import.meta.dirname, '../..');
const settings: SweepRunSettingsInput = {
  sizes: { min: 1, max: 5 },
  form: 'balance',
  derivatives: { method: 'savitzky-golay', window: 9, order: 6 },
  top: 5,
};

async function finished(agent: TestAgent, sweepId: string): Promise<SweepDetail> {
  return eventually('the sweep to end', async () => {
    const sweep = sweepDetailSchema.parse(await (await agent.get(`/api/sweeps/${sweepId}`)).json());
    return ['finished', 'failed', 'cancelled', 'halted'].includes(sweep.state) ? sweep : undefined;
  }, 120_000, 250);
}

describe('a sweep launched through the API agrees with the command line', () => {
  let app: TestApp;
  let workers: TestWorker[] = [];
  let folder: string;

  before(async () => {
    app = await startTestApp({ allowanceDefaults: generousAllowance });
    folder = mkdtempSync(path.join(tmpdir(), 'conserva-parity-'));
  });
  after(async () => {
    await Promise.all(workers.map((w) => w.stop()));
    await app?.close();
    rmSync(folder, { recursive: true, force: true });
  });

  it('finds the same best model, counts and ranking as `conserva discover` on the same files', async () => {
    const team = await createTeamWithUsers(app.orm, 'Parity lab');
    const agent = await signIn(app.baseUrl, team.analyst.email, team.password);
    const projectId = await createProject(agent, 'Cart-pole rig');
    const runs = [...cartPoleTrainingRuns.map((run) => ({ run, role: 'train' as const })), { run: cartPoleValidationRun, role: 'validate' as const }];
    const files = runs.map(({ run, role }, i) => ({ file: `run-${i + 1}.csv`, role, csv: cartPoleCsv(run) }));
    const recordings = [];
    for (const { file, csv } of files) {
      writeFileSync(path.join(folder, file), csv);
      recordings.push(await uploadRecording(agent, projectId, csv, file));
    }
    const generator = cartPoleGenerator({ velocityDegree: 3 });
    const set = await createGeneratedCandidateSet(agent, projectId, 'Generated, velocity degree 3', generator);
    expect(set.candidateCount).to.equal(58);

    workers = await Promise.all([startTestWorker({ shardSubsets: 400_000 }), startTestWorker({ shardSubsets: 400_000 })]);
    const launched = await agent.post(`/api/projects/${projectId}/sweeps`, {
      candidateSetId: set.id,
      trainingRecordingIds: recordings.slice(0, 3).map((r) => r.id),
      validationRecordingIds: [recordings[3]!.id],
      settings,
    });
    expect(launched.status, await launched.clone().text()).to.equal(201);
    const sweep = await finished(agent, sweepDetailSchema.parse(await launched.json()).id);
    expect(sweep.state, sweep.stateReason ?? '').to.equal('finished');
    expect(sweep.shards.length).to.be.above(5);
    expect(sweep.shards.every((s) => s.state === 'done')).to.equal(true);
    const board = sweepLeaderboardSchema.parse(await (await agent.get(`/api/sweeps/${sweep.id}/leaderboard`)).json());

    // The same sweep from the command line: description and CSV files written as a user would.
    writeFileSync(
      path.join(folder, 'description.json'),
      JSON.stringify({
        coordinates: ['x', 'th'],
        terms: set.terms,
        ...settings,
        recordings: files.map(({ file, role }) => ({ file, role })),
        columns: { time: 't_s', x: 'cart_x_m', th: 'pole_angle_rad', forces: { x: 'cart_force_N' } },
      }),
    );
    const { stdout } = await promisify(execFile)(process.execPath, ['--import', 'tsx', 'worker/src/cli/main.ts', 'discover', path.join(folder, 'description.json'), '--json'], {
      cwd: root,
      maxBuffer: 64 * 1024 * 1024,
    });
    const cli: DiscoveryResult = discoveryResultSchema.parse(JSON.parse(stdout));
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

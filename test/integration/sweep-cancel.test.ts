import { expect } from 'chai';
import { sweepDetailSchema } from '../../shared/schemas/sweep.js';
import { sweepLeaderboardSchema } from '../../shared/schemas/sweep-leaderboard.js';
import { Shard } from '../../api/src/entities/shard.js';
import { createTeamWithUsers, signIn } from '../support/fixtures.js';
import { launchSweep, readSweep, setUpCartPoleProject } from '../support/sweep-scenario.js';
import { generousAllowance, startTestApp, type TestApp } from '../support/test-app.js';
import { eventually, startTestWorker, type TestWorker } from '../support/worker-processes.js';

describe('cancelling a sweep (POST /api/sweeps/:id/cancel)', () => {
  let app: TestApp;
  let worker: TestWorker;

  before(async () => {
    app = await startTestApp({ allowanceDefaults: generousAllowance });
    worker = await startTestWorker({ threads: 2, shardSubsets: 20_000_000 });
  });
  after(async () => {
    await worker?.stop();
    await app?.close();
  });

  it('stops running shards within 2 s, never starts queued ones, and keeps the partial leaderboard and who cancelled', async function () {
    this.timeout(180_000);
    const team = await createTeamWithUsers(app.orm, 'Cancel lab');
    const analyst = await signIn(app.baseUrl, team.analyst.email, team.password);
    const project = await setUpCartPoleProject(analyst, 'Cancelled trolley');
    const sweep = await launchSweep(analyst, project.projectId, project.launch(7, 'To be cancelled'));

    // Wait until shards run and at least one has merged, so there is a partial leaderboard to keep.
    await eventually('running shards after a merge', async () => {
      const now = await readSweep(analyst, sweep.id);
      return now.shardsDone >= 1 && now.shards.some((s) => s.state === 'running') ? now : undefined;
    }, 120_000, 50);

    const viewer = await signIn(app.baseUrl, team.viewer.email, team.password);
    expect((await viewer.post(`/api/sweeps/${sweep.id}/cancel`)).status).to.equal(403);
    const other = await createTeamWithUsers(app.orm, 'Bystander lab');
    const outsider = await signIn(app.baseUrl, other.analyst.email, other.password);
    expect((await outsider.post(`/api/sweeps/${sweep.id}/cancel`)).status).to.equal(404);

    const em = app.orm.em.fork();
    const requestedAt = Date.now();
    const response = await analyst.post(`/api/sweeps/${sweep.id}/cancel`);
    expect(response.status).to.equal(200);
    const cancelled = sweepDetailSchema.parse(await response.json());
    expect(cancelled.state).to.equal('cancelled');
    expect(cancelled.cancelledBy).to.deep.equal({ id: team.analyst.id, name: team.analyst.name });
    expect(Date.parse(cancelled.cancelledAt!)).to.be.within(requestedAt - 1000, Date.now() + 1000);
    const queuedAtCancel = cancelled.shards.filter((s) => s.state === 'cancelled' && s.attempts === 0).map((s) => s.id);
    expect(queuedAtCancel.length, 'shards still queued when cancelled').to.be.above(0);

    const stoppedAt = await eventually('every shard to stop', async () => {
      const running = await em.count(Shard, { sweep: sweep.id, state: 'running' });
      return running === 0 ? Date.now() : undefined;
    }, 10_000, 20);
    const latency = stoppedAt - requestedAt;
    console.log(`      all shards stopped ${latency} ms after the cancel request`);
    expect(latency).to.be.at.most(2000);

    // A while later nothing has moved: state, counts and leaderboard persist; queued shards never started.
    const before = sweepLeaderboardSchema.parse(await (await analyst.get(`/api/sweeps/${sweep.id}/leaderboard`)).json());
    await new Promise((resolve) => setTimeout(resolve, 2500));
    const after = await readSweep(analyst, sweep.id);
    const board = sweepLeaderboardSchema.parse(await (await analyst.get(`/api/sweeps/${sweep.id}/leaderboard`)).json());
    expect(after.state).to.equal('cancelled');
    expect(board).to.deep.equal(before);
    expect(board.overall.length).to.be.above(0);
    expect(board.evaluated).to.be.above(0).and.below(sweep.totalSubsets);
    expect(board.result).to.equal(null);
    for (const id of queuedAtCancel) expect(after.shards.find((s) => s.id === id)).to.include({ state: 'cancelled', attempts: 0, startedAt: null });
    expect(after.shards.every((s) => s.state === 'done' || s.state === 'cancelled')).to.equal(true);
    expect(after.evaluated).to.equal(after.shards.reduce((sum, s) => sum + s.evaluated, 0));

    const again = await analyst.post(`/api/sweeps/${sweep.id}/cancel`);
    expect(again.status).to.equal(409);
  });
});

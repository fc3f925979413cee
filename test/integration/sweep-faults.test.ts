import { expect } from 'chai';
import { sweepLeaderboardSchema, type SweepLeaderboard } from '../../shared/schemas/sweep-leaderboard.js';
import type { SweepDetail } from '../../shared/schemas/sweep.js';
import { Shard } from '../../api/src/entities/shard.js';
import { Sweep } from '../../api/src/entities/sweep.js';
import { UsageCharge } from '../../api/src/entities/usage-charge.js';
import { createTeamWithUsers, signIn, type TeamWithUsers, type TestAgent } from '../support/fixtures.js';
import { launchSweep, readSweep, setUpCartPoleProject, type CartPoleProject } from '../support/sweep-scenario.js';
import { generousAllowance, startTestApp, type TestApp } from '../support/test-app.js';
import { eventually, startTestWorker, type TestWorker } from '../support/worker-processes.js';

const shardSubsets = 60_000_000;

async function ended(agent: TestAgent, sweepId: string): Promise<SweepDetail> {
  return eventually('the sweep to end', async () => {
    const sweep = await readSweep(agent, sweepId);
    return ['finished', 'failed', 'cancelled', 'halted'].includes(sweep.state) ? sweep : undefined;
  }, 180_000, 200);
}

async function leaderboard(agent: TestAgent, sweepId: string): Promise<SweepLeaderboard> {
  return sweepLeaderboardSchema.parse(await (await agent.get(`/api/sweeps/${sweepId}/leaderboard`)).json());
}

/** What must not depend on how the sweep was run: the entries, the counts and the worked-out result. */
function comparable(board: SweepLeaderboard) {
  return {
    overall: board.overall,
    bySize: board.bySize,
    evaluated: board.evaluated,
    rejected: board.rejected,
    best: board.result?.best,
    models: board.result?.models.map((m) => [m.terms, m.coefficients, m.rss]),
  };
}

describe('faults: crashed workers, several workers, API restarts', () => {
  let app: TestApp;
  let agent: TestAgent;
  let team: TeamWithUsers;
  let project: CartPoleProject;
  const workers: TestWorker[] = [];
  let reference: { sweep: SweepDetail; board: SweepLeaderboard };

  before(async function () {
    this.timeout(240_000);
    app = await startTestApp({ allowanceDefaults: generousAllowance });
    team = await createTeamWithUsers(app.orm, 'Fault lab');
    agent = await signIn(app.baseUrl, team.analyst.email, team.password);
    project = await setUpCartPoleProject(agent, 'Crash trolley');
  });
  after(async () => {
    await Promise.all(workers.map((w) => w.stop()));
    await app?.close();
  });

  it('shares one sweep between two worker processes: both take shards', async function () {
    this.timeout(240_000);
    const pair = await Promise.all([startTestWorker({ name: 'pair-a', shardSubsets }), startTestWorker({ name: 'pair-b', shardSubsets })]);
    workers.push(...pair);
    const launched = await launchSweep(agent, project.projectId, project.launch(7, 'Uninterrupted'));
    const sweep = await ended(agent, launched.id);
    expect(sweep.state, sweep.stateReason ?? '').to.equal('finished');
    expect(sweep.shards.length).to.equal(Math.ceil(sweep.totalSubsets / shardSubsets));
    expect(new Set(sweep.shards.map((s) => s.worker))).to.deep.equal(new Set(['pair-a', 'pair-b']));
    expect(sweep.evaluated + sweep.rejected).to.equal(sweep.totalSubsets);
    reference = { sweep, board: await leaderboard(agent, sweep.id) };
    await Promise.all(pair.map((w) => w.stop()));
  });

  it('survives SIGKILL of a worker in the middle of a shard: the shard runs again elsewhere, counted once, same leaderboard', async function () {
    this.timeout(240_000);
    const doomed = await startTestWorker({ name: 'doomed', shardSubsets, expireSeconds: 4, maintenanceSeconds: 1 });
    workers.push(doomed);
    const launched = await launchSweep(agent, project.projectId, project.launch(7, 'Interrupted'));
    const em = app.orm.em.fork();
    const victim = await eventually('a shard running on the doomed worker', async () => {
      const shard = await em.findOne(Shard, { sweep: launched.id, state: 'running', worker: 'doomed' }, { refresh: true });
      return shard ?? undefined;
    }, 120_000, 20);
    await new Promise((resolve) => setTimeout(resolve, 300));
    await doomed.kill();
    const survivor = await startTestWorker({ name: 'survivor', shardSubsets, expireSeconds: 4, maintenanceSeconds: 1 });
    workers.push(survivor);

    const sweep = await ended(agent, launched.id);
    expect(sweep.state, sweep.stateReason ?? '').to.equal('finished');
    const rerun = sweep.shards.find((s) => s.id === victim.id)!;
    expect(rerun.attempts, 'the killed shard ran a second time').to.equal(2);
    expect(rerun.worker).to.equal('survivor');
    expect(rerun.state).to.equal('done');
    // Counted once: the counts add up to the rank space exactly, and the ledger has one charge per shard.
    expect(sweep.evaluated + sweep.rejected).to.equal(sweep.totalSubsets);
    expect(sweep.evaluated).to.equal(reference.sweep.evaluated);
    const charges = await em.find(UsageCharge, { sweepId: sweep.id });
    expect(charges.map((c) => c.shardId).sort()).to.deep.equal(sweep.shards.map((s) => s.id).sort());
    expect(charges.reduce((sum, c) => sum + c.subsets, 0)).to.equal(sweep.totalSubsets);
    expect(comparable(await leaderboard(agent, sweep.id))).to.deep.equal(comparable(reference.board));
  });

  it('loses and doubles nothing when the API restarts right after a launch', async function () {
    this.timeout(240_000);
    const launched = await launchSweep(agent, project.projectId, project.launch(5, 'Across a restart'));
    const before = await app.orm.em.fork().count(Sweep, { project: project.projectId });
    await app.close();
    app = await startTestApp({ allowanceDefaults: generousAllowance });
    agent = await signIn(app.baseUrl, team.analyst.email, team.password);
    const sweep = await ended(agent, launched.id);
    expect(sweep.state, sweep.stateReason ?? '').to.equal('finished');
    expect(await app.orm.em.fork().count(Sweep, { project: project.projectId })).to.equal(before);
    const [jobs] = await app.orm.em.fork().execute<{ count: string }[]>(
      `select count(*) as count from (select data from pgboss.job where name = 'sweep-prepare' union all select data from pgboss.archive where name = 'sweep-prepare') j where j.data->>'sweepId' = ?`,
      [launched.id],
    );
    expect(Number(jobs!.count), 'prepare jobs of the sweep').to.equal(1);
  });
});

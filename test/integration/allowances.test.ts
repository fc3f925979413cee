import { expect } from 'chai';
import { allowanceListSchema, allowanceStatusSchema, type AllowanceUpdate } from '../../shared/schemas/allowance.js';
import { apiErrorSchema } from '../../shared/schemas/api-error.js';
import { sweepEstimateSchema } from '../../shared/schemas/sweep.js';
import { sweepLeaderboardSchema } from '../../shared/schemas/sweep-leaderboard.js';
import { Sweep } from '../../api/src/entities/sweep.js';
import { UsageCharge } from '../../api/src/entities/usage-charge.js';
import { createTeamWithUsers, signIn, type TestAgent, type TeamWithUsers } from '../support/fixtures.js';
import { launchSweep, readSweep, setUpCartPoleProject, type CartPoleProject } from '../support/sweep-scenario.js';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { eventually, startTestWorker } from '../support/worker-processes.js';

interface Lab {
  team: TeamWithUsers;
  analyst: TestAgent;
  admin: TestAgent;
  project: CartPoleProject;
}

describe('allowances: limits per team, refusals, halting and race-safe accounting', () => {
  let app: TestApp;

  const labs: Lab[] = [];

  before(async () => {
    app = await startTestApp();
  });
  /** Sweeps left queued here would be taken by the workers of later tests: end them. */
  afterEach(async () => {
    for (const l of labs) {
      await app.orm.em.fork().nativeUpdate(Sweep, { team: l.team.team.id, state: ['queued', 'running'] }, { state: 'cancelled', endedAt: new Date() });
    }
  });
  after(() => app?.close());

  async function lab(label: string): Promise<Lab> {
    const team = await createTeamWithUsers(app.orm, label);
    const analyst = await signIn(app.baseUrl, team.analyst.email, team.password);
    const admin = await signIn(app.baseUrl, team.admin.email, team.password);
    const created = { team, analyst, admin, project: await setUpCartPoleProject(analyst, `${label} rig`) };
    labs.push(created);
    return created;
  }

  async function setLimits(l: Lab, update: AllowanceUpdate) {
    const response = await l.admin.patch(`/api/admin/allowances/${l.team.team.id}`, update);
    expect(response.status, await response.clone().text()).to.equal(200);
    return allowanceStatusSchema.parse(await response.json());
  }

  async function refusal(response: Response): Promise<{ message: string; fields: Record<string, string> }> {
    expect(response.status, 'a refused launch').to.equal(409);
    const { error } = apiErrorSchema.parse(await response.json());
    expect(error.code).to.equal('allowance_exceeded');
    return { message: error.message, fields: error.fields ?? {} };
  }

  async function sweepCount(l: Lab): Promise<number> {
    return app.orm.em.fork().count(Sweep, { project: l.project.projectId });
  }

  it('starts every team with the defaults, lets admins change them, and keeps them from others', async () => {
    const l = await lab('Default lab');
    const own = allowanceStatusSchema.parse(await (await l.analyst.get('/api/allowance')).json());
    expect(own).to.include({ teamId: l.team.team.id, cpuSecondsPerMonth: 36_000, sweepsAtOnce: 2, subsetsPerSweep: 50_000_000, cpuSecondsUsed: 0, sweepsActive: 0 });
    expect((await l.analyst.patch(`/api/admin/allowances/${l.team.team.id}`, { sweepsAtOnce: 9 })).status).to.equal(403);
    const changed = await setLimits(l, { sweepsAtOnce: 3, cpuSecondsPerMonth: 7200 });
    expect(changed).to.include({ sweepsAtOnce: 3, cpuSecondsPerMonth: 7200, subsetsPerSweep: 50_000_000 });
    const list = allowanceListSchema.parse(await (await l.admin.get('/api/admin/allowances')).json());
    expect(list.allowances.find((a) => a.teamId === l.team.team.id)).to.include({ sweepsAtOnce: 3 });
    expect((await l.admin.patch(`/api/admin/allowances/${l.team.team.id}`, {})).status).to.equal(400);
  });

  it('estimates subsets per size and CPU time against the remaining allowance', async () => {
    const l = await lab('Estimate lab');
    const response = await l.analyst.post(`/api/projects/${l.project.projectId}/sweeps/estimate`, l.project.launch(5));
    const estimate = sweepEstimateSchema.parse(await response.json());
    // C(58, s) for s = 1..5 (Knuth, TAOCP 4A, 7.2.1.3; math.comb of Python gives the same).
    expect(estimate.perSize.map((s) => [s.size, s.subsets])).to.deep.equal([[1, 58], [2, 1653], [3, 30856], [4, 424270], [5, 4582116]]);
    expect(estimate.totalSubsets).to.equal(5_038_953);
    const cpu = estimate.perSize.reduce((sum, s) => sum + s.subsets / s.subsetsPerCpuSecond, 0);
    expect(estimate.cpuSeconds).to.be.closeTo(cpu, 1e-9 * cpu);
    expect(estimate).to.deep.include({ fits: true, refusals: [] });
    expect(estimate.allowance.cpuSecondsRemaining).to.equal(36_000);
    expect(await sweepCount(l)).to.equal(0);
  });

  it('refuses a sweep above the subsets-per-sweep limit, stating the limit and the estimate, and stores nothing', async () => {
    const l = await lab('Subset lab');
    await setLimits(l, { subsetsPerSweep: 1_000_000 });
    const { message, fields } = await refusal(await l.analyst.post(`/api/projects/${l.project.projectId}/sweeps`, l.project.launch(5)));
    expect(message).to.equal("This sweep needs about 5,038,953 subsets; your team's limit is 1,000,000 subsets per sweep.");
    expect(Object.keys(fields)).to.deep.equal(['subsetsPerSweep']);
    expect(await sweepCount(l)).to.equal(0);
  });

  it('refuses a sweep beyond the sweeps running at once', async () => {
    const l = await lab('Parallel lab');
    await setLimits(l, { sweepsAtOnce: 1 });
    const first = await launchSweep(l.analyst, l.project.projectId, l.project.launch(3));
    const { message } = await refusal(await l.analyst.post(`/api/projects/${l.project.projectId}/sweeps`, l.project.launch(3)));
    expect(message).to.equal('Your team already has 1 sweep(s) queued or running; its limit is 1 at once.');
    expect((await l.analyst.post(`/api/sweeps/${first.id}/cancel`)).status).to.equal(200);
    await launchSweep(l.analyst, l.project.projectId, l.project.launch(3));
  });

  it('refuses a sweep whose estimated CPU seconds exceed what is left this month', async () => {
    const l = await lab('Budget lab');
    const estimate = sweepEstimateSchema.parse(await (await l.analyst.post(`/api/projects/${l.project.projectId}/sweeps/estimate`, l.project.launch(7))).json());
    const limit = Math.floor(estimate.cpuSeconds / 2);
    await setLimits(l, { cpuSecondsPerMonth: limit, subsetsPerSweep: 1e9 });
    const { message, fields } = await refusal(await l.analyst.post(`/api/projects/${l.project.projectId}/sweeps`, l.project.launch(7)));
    expect(message).to.contain(`This sweep needs about ${Math.ceil(estimate.cpuSeconds).toLocaleString('en-US')} CPU seconds`);
    expect(message).to.contain(`of its ${limit.toLocaleString('en-US')} CPU seconds this month left`);
    expect(Object.keys(fields)).to.deep.equal(['cpuSecondsPerMonth']);
    expect(await sweepCount(l)).to.equal(0);
  });

  it('lets exactly one of two simultaneous launches take the last sweep slot, and the last CPU seconds', async () => {
    const slots = await lab('Race lab');
    await setLimits(slots, { sweepsAtOnce: 1 });
    const launches = await Promise.all([1, 2].map(() => slots.analyst.post(`/api/projects/${slots.project.projectId}/sweeps`, slots.project.launch(3))));
    expect(launches.map((r) => r.status).sort()).to.deep.equal([201, 409]);
    expect(await sweepCount(slots)).to.equal(1);

    const budget = await lab('Race budget lab');
    const estimate = sweepEstimateSchema.parse(await (await budget.analyst.post(`/api/projects/${budget.project.projectId}/sweeps/estimate`, budget.project.launch(6))).json());
    // Room for one of them, not two: the first one's estimate is reserved while it is queued.
    await setLimits(budget, { sweepsAtOnce: 10, cpuSecondsPerMonth: Math.ceil(estimate.cpuSeconds * 1.5) });
    const racing = await Promise.all([1, 2, 3].map(() => budget.analyst.post(`/api/projects/${budget.project.projectId}/sweeps`, budget.project.launch(6))));
    expect(racing.map((r) => r.status).sort()).to.deep.equal([201, 409, 409]);
    expect(await sweepCount(budget)).to.equal(1);
    const status = allowanceStatusSchema.parse(await (await budget.analyst.get('/api/allowance')).json());
    expect(status.cpuSecondsReserved).to.be.closeTo(estimate.cpuSeconds, 1e-6 * estimate.cpuSeconds);
    expect(status.sweepsActive).to.equal(1);
  });

  it('halts a running sweep in its own state when the team runs out, keeping its results, charging measured CPU seconds', async function () {
    this.timeout(240_000);
    const l = await lab('Halt lab');
    await setLimits(l, { cpuSecondsPerMonth: 1_000_000, subsetsPerSweep: 1e9 });
    const worker = await startTestWorker({ threads: 1, shardSubsets: 20_000_000 });
    try {
      const launched = await launchSweep(l.analyst, l.project.projectId, l.project.launch(7, 'Runs out'));
      await eventually('a merged shard', async () => ((await readSweep(l.analyst, launched.id)).shardsDone >= 1 ? true : undefined), 120_000, 100);
      // The admin cuts the month's allowance below what the team has used: the next merged shard halts the sweep.
      await setLimits(l, { cpuSecondsPerMonth: 0 });
      const halted = await eventually('the halt', async () => {
        const sweep = await readSweep(l.analyst, launched.id);
        return sweep.state !== 'running' ? sweep : undefined;
      }, 60_000, 100);
      expect(halted.state).to.equal('halted');
      expect(halted.stateReason).to.contain('allowance of 0 CPU seconds this month is used up');
      expect(halted.endedAt).to.not.equal(null);
      await eventually('every shard to settle', async () => ((await readSweep(l.analyst, launched.id)).shards.every((s) => s.state !== 'running') ? true : undefined), 10_000, 50);
      const settled = await readSweep(l.analyst, launched.id);
      const board = sweepLeaderboardSchema.parse(await (await l.analyst.get(`/api/sweeps/${launched.id}/leaderboard`)).json());
      expect(board.state).to.equal('halted');
      expect(board.overall.length).to.be.above(0);
      expect(settled.evaluated).to.be.above(0).and.below(settled.totalSubsets);
      expect(settled.shards.some((s) => s.state === 'cancelled' && s.attempts === 0)).to.equal(true);

      // Usage is the ledger of measured CPU seconds, one charge per shard that ran.
      const charges = await app.orm.em.fork().find(UsageCharge, { sweepId: launched.id });
      const charged = charges.reduce((sum, c) => sum + c.cpuSeconds, 0);
      expect(charged).to.be.above(0);
      expect(settled.cpuSeconds).to.be.closeTo(charged, 1e-9);
      const status = allowanceStatusSchema.parse(await (await l.analyst.get('/api/allowance')).json());
      expect(status.cpuSecondsUsed).to.be.closeTo(charged, 1e-9);
      expect(status.sweepsActive).to.equal(0);
    } finally {
      await worker.stop();
    }
  });
});

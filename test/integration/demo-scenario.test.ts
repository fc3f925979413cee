import { expect } from 'chai';
import type { MikroORM } from '@mikro-orm/postgresql';
import { demoAccounts, demoTeams } from '../../api/src/db/demo-scenario.js';
import { seedDemo } from '../../api/src/db/seed-demo.js';
import { Project } from '../../api/src/entities/project.js';
import { Team } from '../../api/src/entities/team.js';
import { User } from '../../api/src/entities/user.js';
import { projectListSchema } from '../../shared/schemas/project.js';
import { allowanceDefaultsFrom } from '../../api/src/config.js';
import { inspectionArm, quayCrane } from '../../api/src/demo/demo-mechanisms.js';
import { demoProjectData } from '../../api/src/demo/demo-recordings.js';
import { seedDemoWork } from '../../api/src/demo/seed-demo-work.js';
import { CandidateSet } from '../../api/src/entities/candidate-set.js';
import { Recording } from '../../api/src/entities/recording.js';
import { Sweep } from '../../api/src/entities/sweep.js';
import { createLogger } from '../../api/src/logger.js';
import { QueueClient } from '../../api/src/queue/queue-client.js';
import { sweepLeaderboardSchema } from '../../shared/schemas/sweep-leaderboard.js';
import { expectSameTerms } from '../unit/discovery/recovery-harness.js';
import { signIn } from '../support/fixtures.js';
import { readSweep } from '../support/sweep-scenario.js';
import { testDatabaseUrl } from '../support/test-database.js';
import { eventually, startTestWorker, type TestWorker } from '../support/worker-processes.js';
import { startTestApp, type TestApp } from '../support/test-app.js';

async function counts(orm: MikroORM) {
  const em = orm.em.fork();
  return { teams: await em.count(Team), users: await em.count(User), projects: await em.count(Project) };
}

describe('the demo scenario seeded by npm start', () => {
  let app: TestApp;

  before(async () => {
    app = await startTestApp();
  });
  after(() => app?.close());

  it('seeds once: the second run changes nothing', async () => {
    const first = await seedDemo(app.orm);
    const after = await counts(app.orm);
    const second = await seedDemo(app.orm);
    expect(second.seededNow).to.equal(false);
    expect(await counts(app.orm)).to.deep.equal(after);
    expect(first.accounts.map((a) => a.email)).to.deep.equal(demoAccounts.map((a) => a.email));
  });

  it('has one account per role', () => {
    expect(new Set(demoAccounts.map((a) => a.role))).to.deep.equal(new Set(['admin', 'analyst', 'viewer']));
  });

  it("lets the demo analyst sign in and see exactly the demo team's projects", async () => {
    const analyst = demoAccounts.find((a) => a.role === 'analyst' && a.team === demoTeams[0]!.name)!;
    const agent = await signIn(app.baseUrl, analyst.email, analyst.password);
    const { projects } = projectListSchema.parse(await (await agent.get('/api/projects')).json());
    expect(projects.map((p) => p.name).sort()).to.deep.equal(demoTeams[0]!.projects.map((p) => p.name).sort());
  });
});

describe('the demo work seeded by npm start: recordings, candidate sets, first sweeps', () => {
  let app: TestApp;
  let worker: TestWorker | undefined;

  before(async () => {
    app = await startTestApp();
  });
  after(async () => {
    await worker?.stop();
    await app?.close();
  });

  it('gives each demo project its recordings and a candidate set once, and runs its first sweep to the handbook energy', async function () {
    this.timeout(240_000);
    await seedDemo(app.orm);
    const queue = new QueueClient(testDatabaseUrl(), createLogger('silent', 'demo-test'));
    let launched: number;
    try {
      launched = await seedDemoWork(app.orm, await queue.get(), allowanceDefaultsFrom({}));
      expect(await seedDemoWork(app.orm, await queue.get(), allowanceDefaultsFrom({}))).to.equal(0);
    } finally {
      await queue.close();
    }
    expect(launched).to.equal(demoProjectData.length);

    const em = app.orm.em.fork();
    for (const data of demoProjectData) {
      const project = await em.findOneOrFail(Project, { name: data.project, team: { name: data.team } });
      expect(await em.count(Recording, { project })).to.equal(data.recordings.length);
      expect(await em.count(CandidateSet, { project })).to.equal(1);
    }

    worker = await startTestWorker({ threads: 2 });
    const analyst = demoAccounts.find((a) => a.role === 'analyst' && a.team === demoTeams[0]!.name)!;
    const agent = await signIn(app.baseUrl, analyst.email, analyst.password);
    const expected: Record<string, { terms: Record<string, number>; coordinates: string[] }> = {
      'Quay crane trolley': { terms: quayCrane.energyTerms(), coordinates: ['x', 'th'] },
      'Two-link inspection arm': { terms: inspectionArm.energyTerms(), coordinates: ['sh', 'el'] },
    };
    for (const data of demoProjectData) {
      const project = await em.findOneOrFail(Project, { name: data.project, team: { name: data.team } });
      const sweep = await em.findOneOrFail(Sweep, { project });
      const ended = await eventually('the demo sweep to end', async () => {
        const now = await readSweep(agent, sweep.id);
        return ['finished', 'failed', 'cancelled', 'halted'].includes(now.state) ? now : undefined;
      }, 180_000, 250);
      expect(ended.state, ended.stateReason ?? '').to.equal('finished');
      const board = sweepLeaderboardSchema.parse(await (await agent.get(`/api/sweeps/${sweep.id}/leaderboard`)).json());
      // Handbook energies of the demo machines with their parameters: the hanging pendulum on a driven cart
      // (control textbooks, from memory) and the double pendulum of Landau & Lifshitz, sec. 5, problem 1.
      expectSameTerms(board.result!.best!, expected[data.project]!.terms, expected[data.project]!.coordinates, 1e-3);
    }
  });
});

import { expect } from 'chai';
import type { MikroORM } from '@mikro-orm/postgresql';
import { demoAccounts, demoTeams } from '../../api/src/db/demo-scenario.js';
import { seedDemo } from '../../api/src/db/seed-demo.js';
import { Project } from '../../api/src/entities/project.js';
import { Team } from '../../api/src/entities/team.js';
import { User } from '../../api/src/entities/user.js';
import { projectListSchema } from '../../shared/schemas/project.js';
import { signIn } from '../support/fixtures.js';
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

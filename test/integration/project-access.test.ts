import { expect } from 'chai';
import { apiErrorSchema } from '../../shared/schemas/api-error.js';
import { projectListSchema, projectSummarySchema, type ProjectSummary } from '../../shared/schemas/project.js';
import { Project } from '../../api/src/entities/project.js';
import { createTeamWithUsers, signIn, type TeamWithUsers } from '../support/fixtures.js';
import { startTestApp, type TestApp } from '../support/test-app.js';

async function errorCode(response: Response): Promise<string> {
  return apiErrorSchema.parse(await response.json()).error.code;
}

describe('projects: roles and team isolation (/api/projects)', () => {
  let app: TestApp;
  let mine: TeamWithUsers;
  let theirs: TeamWithUsers;
  let theirProjectId: string;

  before(async () => {
    app = await startTestApp();
    mine = await createTeamWithUsers(app.orm, 'Crane lab');
    theirs = await createTeamWithUsers(app.orm, 'Vineyard lab');
    const em = app.orm.em.fork();
    em.create(Project, { team: em.getReference('Team', mine.team.id), name: 'Gantry rig', description: 'ours' });
    const their = em.create(Project, { team: em.getReference('Team', theirs.team.id), name: 'Pruning arm', description: 'theirs' });
    await em.flush();
    theirProjectId = their.id;
  });
  after(() => app?.close());

  it('requires sign-in to list projects', async () => {
    const response = await fetch(`${app.baseUrl}/api/projects`);
    expect(response.status).to.equal(401);
    expect(await errorCode(response)).to.equal('unauthenticated');
  });

  it("lists only the own team's projects for analysts and viewers", async () => {
    for (const user of [mine.analyst, mine.viewer]) {
      const agent = await signIn(app.baseUrl, user.email, mine.password);
      const { projects } = projectListSchema.parse(await (await agent.get('/api/projects')).json());
      expect(projects.map((p) => p.name)).to.deep.equal(['Gantry rig']);
      expect(projects.every((p) => p.teamId === mine.team.id)).to.equal(true);
    }
  });

  it('lists every team’s projects for admins', async () => {
    const agent = await signIn(app.baseUrl, mine.admin.email, mine.password);
    const { projects } = projectListSchema.parse(await (await agent.get('/api/projects')).json());
    expect(projects.map((p) => p.name)).to.include.members(['Gantry rig', 'Pruning arm']);
  });

  it("answers 404 when a user asks for another team's project, for reading and for changing", async () => {
    const agent = await signIn(app.baseUrl, mine.analyst.email, mine.password);
    for (const response of [
      await agent.get(`/api/projects/${theirProjectId}`),
      await agent.patch(`/api/projects/${theirProjectId}`, { name: 'Taken over' }),
      await agent.delete(`/api/projects/${theirProjectId}`),
    ]) {
      expect(response.status).to.equal(404);
      expect(await errorCode(response)).to.equal('not_found');
    }
    const still = await app.orm.em.fork().findOneOrFail(Project, { id: theirProjectId });
    expect(still.name).to.equal('Pruning arm');
  });

  it('answers 404, not 500, for an id that is not a UUID', async () => {
    const agent = await signIn(app.baseUrl, mine.viewer.email, mine.password);
    expect((await agent.get('/api/projects/not-a-uuid')).status).to.equal(404);
  });

  it('refuses a viewer every state-changing route with 403', async () => {
    const agent = await signIn(app.baseUrl, mine.viewer.email, mine.password);
    const { projects } = projectListSchema.parse(await (await agent.get('/api/projects')).json());
    const ownId = projects[0]!.id;
    for (const response of [
      await agent.post('/api/projects', { name: 'Viewer rig' }),
      await agent.patch(`/api/projects/${ownId}`, { name: 'Renamed by viewer' }),
      await agent.delete(`/api/projects/${ownId}`),
    ]) {
      expect(response.status).to.equal(403);
      expect(await errorCode(response)).to.equal('forbidden');
    }
    expect(await app.orm.em.fork().count(Project, { team: mine.team.id })).to.equal(1);
  });

  it('lets an analyst create, read, rename and delete a project in the own team', async () => {
    const agent = await signIn(app.baseUrl, mine.analyst.email, mine.password);
    const created = await agent.post('/api/projects', { name: '  Swing-arm rig ', description: 'Arm on a 0.8 m pivot.' });
    expect(created.status).to.equal(201);
    const project: ProjectSummary = projectSummarySchema.parse(await created.json());
    expect(project).to.include({ name: 'Swing-arm rig', description: 'Arm on a 0.8 m pivot.', teamId: mine.team.id });

    const read = projectSummarySchema.parse(await (await agent.get(`/api/projects/${project.id}`)).json());
    expect(read).to.deep.equal(project);

    const patched = await agent.patch(`/api/projects/${project.id}`, { name: 'Swing-arm rig B', description: 'Second build.' });
    expect(patched.status).to.equal(200);
    expect(projectSummarySchema.parse(await patched.json())).to.include({ name: 'Swing-arm rig B', description: 'Second build.' });

    expect((await agent.delete(`/api/projects/${project.id}`)).status).to.equal(204);
    expect((await agent.get(`/api/projects/${project.id}`)).status).to.equal(404);
  });

  it('does not let an analyst create a project in another team', async () => {
    const agent = await signIn(app.baseUrl, mine.analyst.email, mine.password);
    const response = await agent.post('/api/projects', { name: 'Smuggled rig', teamId: theirs.team.id });
    expect(response.status).to.equal(404);
    expect(await app.orm.em.fork().count(Project, { name: 'Smuggled rig' })).to.equal(0);
  });

  it('lets an admin create a project in any team', async () => {
    const agent = await signIn(app.baseUrl, mine.admin.email, mine.password);
    const response = await agent.post('/api/projects', { name: 'Admin-made rig', teamId: theirs.team.id });
    expect(response.status).to.equal(201);
    expect(projectSummarySchema.parse(await response.json()).teamId).to.equal(theirs.team.id);
  });

  it('answers 409 for a second project of the same name in a team', async () => {
    const agent = await signIn(app.baseUrl, mine.analyst.email, mine.password);
    const response = await agent.post('/api/projects', { name: 'Gantry rig' });
    expect(response.status).to.equal(409);
    const { error } = apiErrorSchema.parse(await response.json());
    expect(error.code).to.equal('conflict');
    expect(error.fields).to.have.key('name');
  });

  it('validates the body with the shared schema and names the field', async () => {
    const agent = await signIn(app.baseUrl, mine.analyst.email, mine.password);
    const response = await agent.post('/api/projects', { name: '', description: 42 });
    expect(response.status).to.equal(400);
    const { error } = apiErrorSchema.parse(await response.json());
    expect(error.code).to.equal('invalid_body');
    expect(error.fields).to.have.keys('name', 'description');
  });
});

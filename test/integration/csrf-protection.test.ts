import { expect } from 'chai';
import { apiErrorSchema } from '../../shared/schemas/api-error.js';
import { sessionStateSchema } from '../../shared/schemas/session.js';
import { Project } from '../../api/src/entities/project.js';
import { anonymousAgent, createTeamWithUsers, signIn, TestAgent, type TeamWithUsers } from '../support/fixtures.js';
import { startTestApp, type TestApp } from '../support/test-app.js';

async function expectCsrfRefusal(response: Response): Promise<void> {
  expect(response.status).to.equal(403);
  expect(apiErrorSchema.parse(await response.json()).error.code).to.equal('csrf');
}

describe('cross-site request forgery protection', () => {
  let app: TestApp;
  let people: TeamWithUsers;

  before(async () => {
    app = await startTestApp();
    people = await createTeamWithUsers(app.orm, 'Forgery');
  });
  after(() => app?.close());

  it('refuses a state-changing request without the X-XSRF-TOKEN header and changes nothing', async () => {
    const agent = await signIn(app.baseUrl, people.analyst.email, people.password);
    await expectCsrfRefusal(await agent.post('/api/projects', { name: 'Forged rig' }, { withoutCsrf: true }));
    expect(await app.orm.em.fork().count(Project, { team: people.team.id, name: 'Forged rig' })).to.equal(0);
  });

  it('refuses a token that belongs to another session', async () => {
    const victim = await signIn(app.baseUrl, people.analyst.email, people.password);
    const attacker = await anonymousAgent(app.baseUrl);
    const response = await victim.post('/api/projects', { name: 'Forged rig 2' }, {
      withoutCsrf: true,
      headers: { 'X-XSRF-TOKEN': decodeURIComponent(attacker.cookies.get('XSRF-TOKEN')!) },
    });
    await expectCsrfRefusal(response);
  });

  it('refuses a request from another origin even with the right token', async () => {
    const agent = await signIn(app.baseUrl, people.analyst.email, people.password);
    await expectCsrfRefusal(await agent.post('/api/projects', { name: 'Forged rig 3' }, { headers: { Origin: 'https://evil.example' } }));
  });

  it('accepts the same request with the token from the same origin', async () => {
    const agent = await signIn(app.baseUrl, people.analyst.email, people.password);
    const response = await agent.post('/api/projects', { name: 'Honest rig' }, { headers: { Origin: app.baseUrl } });
    expect(response.status).to.equal(201);
  });

  it('refuses a sign-in that did not first fetch a token (login forgery)', async () => {
    const agent = new TestAgent(app.baseUrl);
    await expectCsrfRefusal(await agent.post('/api/session', { email: people.analyst.email, password: people.password }));
  });

  it('refuses sign-out without the token, so the session survives', async () => {
    const agent = await signIn(app.baseUrl, people.viewer.email, people.password);
    await expectCsrfRefusal(await agent.delete('/api/session', { withoutCsrf: true }));
    const state = sessionStateSchema.parse(await (await agent.get('/api/session')).json());
    expect(state.user?.id).to.equal(people.viewer.id);
  });
});

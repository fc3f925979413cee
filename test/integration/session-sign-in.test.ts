import { expect } from 'chai';
import { sessionStateSchema } from '../../shared/schemas/session.js';
import { apiErrorSchema } from '../../shared/schemas/api-error.js';
import { AuditEvent } from '../../api/src/entities/audit-event.js';
import { anonymousAgent, createTeamWithUsers, signIn, type TeamWithUsers } from '../support/fixtures.js';
import { startTestApp, type TestApp } from '../support/test-app.js';

describe('sign-in and sign-out (POST/GET/DELETE /api/session)', () => {
  let app: TestApp;
  let people: TeamWithUsers;

  before(async () => {
    app = await startTestApp();
    people = await createTeamWithUsers(app.orm, 'Session');
  });
  after(() => app?.close());

  it('answers GET with no user before sign-in and hands out a readable XSRF-TOKEN cookie', async () => {
    const agent = await anonymousAgent(app.baseUrl);
    const response = await agent.get('/api/session');
    expect(sessionStateSchema.parse(await response.json())).to.deep.equal({ user: null });
    expect(agent.cookies.get('XSRF-TOKEN')).to.match(/^[\w-]{40,}$/);
    const setCookie = (await (await fetch(`${app.baseUrl}/api/session`)).headers.getSetCookie()).join('\n');
    expect(setCookie).to.match(/XSRF-TOKEN=/).and.not.to.match(/XSRF-TOKEN=[^;]*;[^\n]*HttpOnly/i);
  });

  it('signs in with the right password, returns the session user and regenerates the session id', async () => {
    const agent = await anonymousAgent(app.baseUrl);
    const sidBefore = agent.cookies.get('conserva.sid');
    expect(sidBefore, 'an anonymous session exists before sign-in').to.be.a('string');
    const tokenBefore = agent.cookies.get('XSRF-TOKEN');
    const response = await agent.post('/api/session', { email: people.analyst.email.toUpperCase(), password: people.password });
    expect(response.status).to.equal(200);
    const state = sessionStateSchema.parse(await response.json());
    expect(state.user).to.deep.equal({
      id: people.analyst.id,
      email: people.analyst.email,
      name: people.analyst.name,
      role: 'analyst',
      team: { id: people.team.id, name: people.team.name },
    });
    expect(agent.cookies.get('conserva.sid')).to.be.a('string').and.not.equal(sidBefore);
    expect(agent.cookies.get('XSRF-TOKEN')).to.be.a('string').and.not.equal(tokenBefore);
    const again = sessionStateSchema.parse(await (await agent.get('/api/session')).json());
    expect(again.user?.id).to.equal(people.analyst.id);
  });

  it('answers a wrong password with 401 bad_credentials and leaves no signed-in session', async () => {
    const agent = await anonymousAgent(app.baseUrl);
    const response = await agent.post('/api/session', { email: people.viewer.email, password: `${people.password}x` });
    expect(response.status).to.equal(401);
    expect(apiErrorSchema.parse(await response.json()).error.code).to.equal('bad_credentials');
    const state = sessionStateSchema.parse(await (await agent.get('/api/session')).json());
    expect(state.user).to.equal(null);
    expect((await agent.get('/api/projects')).status).to.equal(401);
  });

  it('answers an unknown e-mail exactly like a wrong password', async () => {
    const agent = await anonymousAgent(app.baseUrl);
    const unknown = await agent.post('/api/session', { email: 'nobody.at.all@test.example', password: people.password });
    const wrong = await agent.post('/api/session', { email: people.viewer.email, password: 'not-the-password' });
    expect(unknown.status).to.equal(401);
    expect(await unknown.json()).to.deep.equal(await wrong.json());
  });

  it('rejects a malformed sign-in body with 400 and a message per field', async () => {
    const agent = await anonymousAgent(app.baseUrl);
    const response = await agent.post('/api/session', { email: 'not-an-email' });
    expect(response.status).to.equal(400);
    const { error } = apiErrorSchema.parse(await response.json());
    expect(error.code).to.equal('invalid_body');
    expect(error.fields).to.have.keys('email', 'password');
  });

  it('signs out with 204; the old session cookie no longer signs anyone in', async () => {
    const agent = await signIn(app.baseUrl, people.admin.email, people.password);
    const oldSid = agent.cookies.get('conserva.sid')!;
    expect((await agent.delete('/api/session')).status).to.equal(204);
    expect(sessionStateSchema.parse(await (await agent.get('/api/session')).json()).user).to.equal(null);
    const replay = await fetch(`${app.baseUrl}/api/session`, { headers: { Cookie: `conserva.sid=${oldSid}` } });
    expect(sessionStateSchema.parse(await replay.json()).user).to.equal(null);
  });

  it('records sign-in, failed sign-in and sign-out in the audit trail', async () => {
    const agent = await signIn(app.baseUrl, people.viewer.email, people.password);
    await agent.delete('/api/session');
    await (await anonymousAgent(app.baseUrl)).post('/api/session', { email: people.viewer.email, password: 'wrong-password' });
    const events = await app.orm.em.fork().find(AuditEvent, { actorEmail: people.viewer.email }, { orderBy: { createdAt: 'asc' } });
    const actions = events.map((event) => event.action);
    expect(actions).to.include.members(['session.signed_in', 'session.signed_out', 'session.sign_in_failed']);
    const signedIn = events.find((event) => event.action === 'session.signed_in')!;
    expect(signedIn.actorId).to.equal(people.viewer.id);
    expect(signedIn.teamId).to.equal(people.team.id);
  });
});

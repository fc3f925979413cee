import { expect } from 'chai';
import { apiErrorSchema } from '../../shared/schemas/api-error.js';
import { auditEventListSchema } from '../../shared/schemas/audit-event.js';
import { sessionStateSchema } from '../../shared/schemas/session.js';
import { adminTeamListSchema, adminTeamSchema } from '../../shared/schemas/team-admin.js';
import { adminUserListSchema, adminUserSchema } from '../../shared/schemas/user-admin.js';
import { anonymousAgent, createTeamWithUsers, signIn, type TeamWithUsers, type TestAgent } from '../support/fixtures.js';
import { startTestApp, type TestApp } from '../support/test-app.js';

describe('administration of teams, users and roles (/api/admin)', () => {
  let app: TestApp;
  let people: TeamWithUsers;
  let admin: TestAgent;

  before(async () => {
    app = await startTestApp();
    people = await createTeamWithUsers(app.orm, 'Admin desk');
    admin = await signIn(app.baseUrl, people.admin.email, people.password);
  });
  after(() => app?.close());

  it('is closed to analysts and viewers (403) and to visitors (401)', async () => {
    for (const user of [people.analyst, people.viewer]) {
      const agent = await signIn(app.baseUrl, user.email, people.password);
      expect((await agent.get('/api/admin/users')).status).to.equal(403);
      expect((await agent.post('/api/admin/teams', { name: 'Sneaky team' })).status).to.equal(403);
    }
    expect((await (await anonymousAgent(app.baseUrl)).get('/api/admin/teams')).status).to.equal(401);
  });

  it('creates and renames a team and lists it with its counts', async () => {
    const created = await admin.post('/api/admin/teams', { name: 'Winch test bay' });
    expect(created.status).to.equal(201);
    const team = adminTeamSchema.parse(await created.json());
    const renamed = adminTeamSchema.parse(await (await admin.patch(`/api/admin/teams/${team.id}`, { name: 'Winch test bay 2' })).json());
    expect(renamed.name).to.equal('Winch test bay 2');
    const { teams } = adminTeamListSchema.parse(await (await admin.get('/api/admin/teams')).json());
    expect(teams.find((t) => t.id === people.team.id)).to.include({ userCount: 3, projectCount: 0 });
    expect(teams.find((t) => t.id === team.id)).to.include({ name: 'Winch test bay 2', userCount: 0 });
  });

  it('creates a user who can then sign in with the given role and team', async () => {
    const { teams } = adminTeamListSchema.parse(await (await admin.get('/api/admin/teams')).json());
    const bay = teams.find((t) => t.name === 'Winch test bay 2')!;
    const email = `new.analyst.${Date.now()}@test.example`;
    const response = await admin.post('/api/admin/users', { email, name: 'New Analyst', password: 'a-long-enough-secret', role: 'analyst', teamId: bay.id });
    expect(response.status).to.equal(201);
    expect(adminUserSchema.parse(await response.json())).to.include({ email, role: 'analyst' });
    const agent = await signIn(app.baseUrl, email, 'a-long-enough-secret');
    const state = sessionStateSchema.parse(await (await agent.get('/api/session')).json());
    expect(state.user).to.include({ role: 'analyst' });
    expect(state.user?.team.id).to.equal(bay.id);
  });

  it('changes a role, and the change applies to a session already signed in', async () => {
    const viewerEmail = `promoted.${Date.now()}@test.example`;
    const created = adminUserSchema.parse(
      await (await admin.post('/api/admin/users', { email: viewerEmail, name: 'To promote', password: 'another-long-secret', role: 'viewer', teamId: people.team.id })).json(),
    );
    const agent = await signIn(app.baseUrl, viewerEmail, 'another-long-secret');
    expect((await agent.post('/api/projects', { name: 'Before promotion' })).status).to.equal(403);
    const patched = await admin.patch(`/api/admin/users/${created.id}`, { role: 'analyst' });
    expect(adminUserSchema.parse(await patched.json()).role).to.equal('analyst');
    expect((await agent.post('/api/projects', { name: 'After promotion' })).status).to.equal(201);
  });

  it('refuses an admin changing their own role or deleting their own account', async () => {
    const own = people.admin.id;
    expect((await admin.patch(`/api/admin/users/${own}`, { role: 'viewer' })).status).to.equal(409);
    expect((await admin.delete(`/api/admin/users/${own}`)).status).to.equal(409);
  });

  it('refuses to delete a team that still has users, and deletes an empty one', async () => {
    const busy = await admin.delete(`/api/admin/teams/${people.team.id}`);
    expect(busy.status).to.equal(409);
    expect(apiErrorSchema.parse(await busy.json()).error.code).to.equal('conflict');
    const empty = adminTeamSchema.parse(await (await admin.post('/api/admin/teams', { name: `Empty bay ${Date.now()}` })).json());
    expect((await admin.delete(`/api/admin/teams/${empty.id}`)).status).to.equal(204);
  });

  it('answers 409 for a second account with the same e-mail, whatever its case', async () => {
    const response = await admin.post('/api/admin/users', {
      email: people.viewer.email.toUpperCase(), name: 'Twin', password: 'yet-another-secret', role: 'viewer', teamId: people.team.id,
    });
    expect(response.status).to.equal(409);
  });

  it('rejects a short password with a field message', async () => {
    const response = await admin.post('/api/admin/users', { email: 'short.pw@test.example', name: 'Short', password: 'short', role: 'viewer', teamId: people.team.id });
    expect(response.status).to.equal(400);
    expect(apiErrorSchema.parse(await response.json()).error.fields).to.have.key('password');
  });

  it('lists users of one team and records every admin change in the audit trail', async () => {
    const { users } = adminUserListSchema.parse(await (await admin.get(`/api/admin/users?teamId=${people.team.id}`)).json());
    expect(users.map((u) => u.email)).to.include.members([people.admin.email, people.analyst.email, people.viewer.email]);
    expect(users.every((u) => u.team.id === people.team.id)).to.equal(true);
    const { events } = auditEventListSchema.parse(await (await admin.get('/api/admin/audit-events?limit=200')).json());
    const mine = events.filter((e) => e.actorId === people.admin.id).map((e) => e.action);
    expect(mine).to.include.members(['team.created', 'team.renamed', 'team.deleted', 'user.created', 'user.updated', 'session.signed_in']);
  });
});

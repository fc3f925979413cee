import { expect } from 'chai';
import { Project } from '../../api/src/entities/project.js';
import { User } from '../../api/src/entities/user.js';
import { createTeamWithUsers, signIn, type TeamWithUsers } from '../support/fixtures.js';
import { startTestApp, type TestApp } from '../support/test-app.js';

/** Every key in a JSON value, at any depth. */
function keysOf(value: unknown): string[] {
  if (Array.isArray(value)) return value.flatMap(keysOf);
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([key, inner]) => [key, ...keysOf(inner)]);
  return [];
}

describe('passwords never leave the server', () => {
  let app: TestApp;
  let people: TeamWithUsers;
  let storedHash: string;

  before(async () => {
    app = await startTestApp();
    people = await createTeamWithUsers(app.orm, 'Secrecy');
    const em = app.orm.em.fork();
    em.create(Project, { team: people.team, name: 'Hoist rig', description: '' });
    await em.flush();
    storedHash = (await em.findOneOrFail(User, { id: people.admin.id })).passwordHash;
    expect(storedHash).to.match(/^scrypt\$/);
  });
  after(() => app?.close());

  it('no answer of any route carries a password, its hash or a key naming one', async () => {
    const admin = await signIn(app.baseUrl, people.admin.email, people.password);
    const newUserPassword = 'fresh-password-for-leak-check';
    const projectId = ((await (await admin.get('/api/projects')).json()) as { projects: { id: string }[] }).projects[0]!.id;
    const bodies: { route: string; text: string }[] = [];
    const record = async (route: string, response: Promise<Response>) => bodies.push({ route, text: await (await response).text() });

    await record('POST /api/session', admin.post('/api/session', { email: people.admin.email, password: people.password }));
    await record('GET /api/session', admin.get('/api/session'));
    await record('GET /api/projects', admin.get('/api/projects'));
    await record('GET /api/projects/:id', admin.get(`/api/projects/${projectId}`));
    await record('PATCH /api/projects/:id', admin.patch(`/api/projects/${projectId}`, { name: 'Hoist rig', description: 'x' }));
    await record('POST /api/projects', admin.post('/api/projects', { name: 'Leak check rig' }));
    await record('GET /api/admin/users', admin.get('/api/admin/users'));
    await record('GET /api/admin/teams', admin.get('/api/admin/teams'));
    const created = admin.post('/api/admin/users', { email: `leak.${Date.now()}@test.example`, name: 'Leak', password: newUserPassword, role: 'viewer', teamId: people.team.id });
    await record('POST /api/admin/users', created);
    const newId = (JSON.parse(bodies.at(-1)!.text) as { id: string }).id;
    await record('PATCH /api/admin/users/:id', admin.patch(`/api/admin/users/${newId}`, { password: `${newUserPassword}-2` }));
    await record('GET /api/admin/audit-events', admin.get('/api/admin/audit-events?limit=500'));
    await record('GET /api/health', admin.get('/api/health'));

    for (const { route, text } of bodies) {
      expect(text, route).not.to.include(people.password);
      expect(text, route).not.to.include(newUserPassword);
      expect(text, route).not.to.include(storedHash);
      expect(text, route).not.to.match(/scrypt\$/);
      if (text) expect(keysOf(JSON.parse(text)).filter((key) => /password/i.test(key)), route).to.deep.equal([]);
    }
  });
});

import { expect } from 'chai';
import { apiErrorSchema } from '../../shared/schemas/api-error.js';
import { sessionStateSchema } from '../../shared/schemas/session.js';
import { anonymousAgent, createTeamWithUsers, signIn, type TeamWithUsers } from '../support/fixtures.js';
import { startTestApp, type TestApp } from '../support/test-app.js';

describe('sign-in throttling (5 failures per minute per address and e-mail)', () => {
  let app: TestApp;
  let people: TeamWithUsers;

  before(async () => {
    app = await startTestApp(); // the production defaults: 5 failures per 60 s
    people = await createTeamWithUsers(app.orm, 'Throttle');
  });
  after(() => app?.close());

  it('answers the sixth failed sign-in within a minute with 429, even with the right password', async () => {
    const agent = await anonymousAgent(app.baseUrl);
    for (let attempt = 1; attempt <= 5; attempt++) {
      const response = await agent.post('/api/session', { email: people.analyst.email, password: `wrong-${attempt}` });
      expect(response.status, `failed attempt ${attempt}`).to.equal(401);
    }
    const sixth = await agent.post('/api/session', { email: people.analyst.email, password: people.password });
    expect(sixth.status).to.equal(429);
    expect(apiErrorSchema.parse(await sixth.json()).error.code).to.equal('too_many_requests');
    expect(sixth.headers.get('ratelimit-policy')).to.match(/q=5;\s*w=60/);
  });

  it('keeps counting per e-mail: another account from the same address can still sign in', async () => {
    const agent = await signIn(app.baseUrl, people.viewer.email, people.password);
    const state = sessionStateSchema.parse(await (await agent.get('/api/session')).json());
    expect(state.user?.email).to.equal(people.viewer.email);
  });

  it('does not count successful sign-ins', async () => {
    for (let round = 0; round < 8; round++) await signIn(app.baseUrl, people.admin.email, people.password);
    const agent = await anonymousAgent(app.baseUrl);
    expect((await agent.post('/api/session', { email: people.admin.email, password: 'wrong' })).status).to.equal(401);
  });
});

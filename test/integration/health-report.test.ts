import { expect } from 'chai';
import { healthSchema } from '../../shared/schemas/health.js';
import { startTestApp, type TestApp } from '../support/test-app.js';

describe('GET /api/health', () => {
  let app: TestApp;

  beforeEach(async () => {
    app = await startTestApp();
  });
  afterEach(() => app?.close());

  it('reports ok with the database up, without signing in', async () => {
    const response = await fetch(`${app.baseUrl}/api/health`);
    expect(response.status).to.equal(200);
    expect(healthSchema.parse(await response.json())).to.deep.include({ status: 'ok', database: 'up' });
  });

  it('reports degraded with 503 when the database connection is gone', async () => {
    await app.orm.close(true);
    const response = await fetch(`${app.baseUrl}/api/health`);
    expect(response.status).to.equal(503);
    expect(healthSchema.parse(await response.json())).to.deep.include({ status: 'degraded', database: 'down' });
  });

  it('tags every response with a request id, and keeps a sane one given by a proxy', async () => {
    const own = await fetch(`${app.baseUrl}/api/health`);
    expect(own.headers.get('x-request-id')).to.match(/^[0-9a-f-]{36}$/);
    const given = await fetch(`${app.baseUrl}/api/health`, { headers: { 'X-Request-Id': 'proxy-42' } });
    expect(given.headers.get('x-request-id')).to.equal('proxy-42');
  });
});

import { expect } from 'chai';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { apiErrorSchema } from '../../shared/schemas/api-error.js';
import { startTestApp, type TestApp } from '../support/test-app.js';

const indexHtml = '<!doctype html><title>stand-in app</title><script src="main-abc123.js"></script>';

describe('serving the web app with history fallback', () => {
  let app: TestApp;
  let webDir: string;

  before(async () => {
    // A stand-in build in Angular's layout (<outputPath>/browser), so this test does not depend on ng build.
    webDir = mkdtempSync(path.join(tmpdir(), 'conserva-web-'));
    mkdirSync(path.join(webDir, 'browser'));
    writeFileSync(path.join(webDir, 'browser', 'index.html'), indexHtml);
    writeFileSync(path.join(webDir, 'browser', 'main-abc123.js'), 'console.log("app");');
    app = await startTestApp({ webDir });
  });
  after(async () => {
    await app?.close();
    rmSync(webDir, { recursive: true, force: true });
  });

  it('serves index.html at / and at deep links, never cached', async () => {
    for (const url of ['/', '/projects/7/recordings', '/sign-in']) {
      const response = await fetch(`${app.baseUrl}${url}`);
      expect(response.status, url).to.equal(200);
      expect(await response.text(), url).to.equal(indexHtml);
      expect(response.headers.get('cache-control'), url).to.equal('no-cache');
    }
  });

  it('serves hashed bundles with a long cache lifetime', async () => {
    const response = await fetch(`${app.baseUrl}/main-abc123.js`);
    expect(await response.text()).to.equal('console.log("app");');
    expect(response.headers.get('cache-control')).to.match(/max-age=31536000.*immutable/);
  });

  it('answers unknown /api paths with the JSON error shape, not the app', async () => {
    const response = await fetch(`${app.baseUrl}/api/no-such-route`);
    expect(response.status).to.equal(404);
    expect(apiErrorSchema.parse(await response.json()).error.code).to.equal('not_found');
  });

  it('sends a content security policy that allows only our own origin for scripts', async () => {
    const csp = (await fetch(`${app.baseUrl}/`)).headers.get('content-security-policy') ?? '';
    expect(csp).to.include("script-src 'self'").and.include("default-src 'self'").and.include("object-src 'none'");
    expect(csp).not.to.match(/script-src[^;]*unsafe-inline/);
  });
});

describe('serving without a built web app', () => {
  let app: TestApp;

  before(async () => {
    app = await startTestApp({ webDir: path.join(tmpdir(), 'conserva-no-such-build') });
  });
  after(() => app?.close());

  it('explains how to build it instead of failing', async () => {
    const response = await fetch(`${app.baseUrl}/projects`);
    expect(response.status).to.equal(503);
    expect(await response.text()).to.include('npx ng build');
  });
});

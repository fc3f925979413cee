import { expect } from 'chai';
import { chmodSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { runningClusterPort, startCluster, stopCluster, type ClusterSpec } from '../../ops/pg-cluster.js';
import { findPostgresBin } from '../../ops/postgres-binaries.js';
import { freePort } from '../support/test-database.js';

async function answers(url: string): Promise<string> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query<{ who: string }>('select current_user as who')).rows[0]!.who;
  } finally {
    await client.end();
  }
}

describe('the private PostgreSQL cluster script (ops/pg-cluster.ts)', () => {
  let spec: ClusterSpec;

  before(() => {
    const bin = findPostgresBin();
    if (!bin) throw new Error('Debian PostgreSQL binaries are missing; .ci/run installs them');
    const parent = mkdtempSync(path.join(tmpdir(), 'conserva-cluster-check-'));
    chmodSync(parent, 0o755); // mkdtemp makes it private, but the server's OS user must pass through it
    const dir = path.join(parent, 'cluster');
    spec = { dir, bin, port: 0, database: 'conserva_check', role: 'conserva_check', throwaway: true };
  });
  after(() => {
    if (!spec) return;
    stopCluster(spec, 'immediate');
    rmSync(path.dirname(spec.dir), { recursive: true, force: true });
  });

  it('initializes, starts, and is idempotent: a second start reuses the running server', async function () {
    spec.port = await freePort(55600);
    const first = await startCluster(spec);
    expect(first.startedNow).to.equal(true);
    expect(await answers(first.url)).to.equal('conserva_check');
    const second = await startCluster(spec);
    expect(second.startedNow).to.equal(false);
    expect(second.url).to.equal(first.url);
  });

  it('listens on loopback only and demands the generated password', async () => {
    const url = new URL((await startCluster(spec)).url);
    expect(url.hostname).to.equal('127.0.0.1');
    url.password = 'wrong';
    let refused = '';
    await answers(url.toString()).catch((error: Error) => (refused = error.message));
    expect(refused).to.match(/password authentication failed/);
  });

  it('keeps its data folder private to the server user', () => {
    expect(statSync(path.join(spec.dir, 'data')).mode & 0o077).to.equal(0);
    if (process.getuid?.() === 0) expect(statSync(path.join(spec.dir, 'data')).uid).not.to.equal(0);
  });

  it('stops cleanly, and stopping again is harmless', () => {
    expect(stopCluster(spec)).to.equal(true);
    expect(runningClusterPort(spec)).to.equal(null);
    expect(stopCluster(spec)).to.equal(false);
  });

  it('starts again on the data it already has', async () => {
    const again = await startCluster(spec);
    expect(again.startedNow).to.equal(true);
    expect(await answers(again.url)).to.equal('conserva_check');
  });
});

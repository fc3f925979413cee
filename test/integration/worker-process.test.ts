import { expect } from 'chai';
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { testDatabaseUrl } from '../support/test-database.js';

const root = path.resolve(import.meta.dirname, '../..');

function waitForLog(child: ChildProcess, pattern: RegExp, timeoutMs: number): Promise<string> {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`no log line matching ${pattern} within ${timeoutMs} ms`)), timeoutMs);
    createInterface({ input: child.stdout! }).on('line', (line) => {
      const entry = JSON.parse(line) as { msg?: string };
      if (pattern.test(entry.msg ?? '')) {
        clearTimeout(timer);
        resolve(entry.msg!);
      }
    });
    child.on('exit', (code) => reject(new Error(`worker exited (${code}) before logging ${pattern}`)));
  });
}

describe('the worker process (worker/src/main.ts)', () => {
  it('connects the job queue, says it waits for work, and stops cleanly on SIGTERM', async () => {
    const child = spawn(process.execPath, ['--import', 'tsx', 'worker/src/main.ts'], {
      cwd: root,
      env: { ...process.env, DATABASE_URL: testDatabaseUrl(), CONSERVA_LOG_LEVEL: 'info' },
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    try {
      expect(await waitForLog(child, /waiting for work/, 60_000)).to.match(/job queue/);
      const exited = new Promise<number | null>((resolve) => child.on('exit', resolve));
      child.kill('SIGTERM');
      expect(await exited).to.equal(0);
    } finally {
      if (child.exitCode === null) child.kill('SIGKILL');
    }
  });
});

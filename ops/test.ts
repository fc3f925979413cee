/**
 * `npm test`: type check, unit tests, the web app's own unit tests, then integration and browser tests
 * against a throwaway PostgreSQL cluster (started by the mocha global setup in test/support). The web app is
 * built first when it is stale. Every stage runs even after a failure; the exit code is non-zero if any failed.
 */
import { spawn } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { projectRoot } from './dev-database.js';
import { buildWebIfStale } from './web-build.js';

interface StageResult {
  name: string;
  outcome: 'passed' | 'failed' | 'skipped';
  seconds: number;
  note?: string;
}

const results: StageResult[] = [];

function heading(text: string): void {
  console.log(`\n━━ ${text} ${'━'.repeat(Math.max(0, 70 - text.length))}`);
}

function run(command: string, args: string[], env: NodeJS.ProcessEnv = {}): Promise<boolean> {
  return new Promise((resolve) => {
    const child = spawn(command, args, { cwd: projectRoot, stdio: ['ignore', 'inherit', 'inherit'], env: { ...process.env, ...env } });
    child.on('error', () => resolve(false));
    child.on('exit', (code) => resolve(code === 0));
  });
}

async function stage(name: string, body: () => Promise<boolean | string>): Promise<void> {
  heading(name);
  const started = Date.now();
  const outcome = await body();
  const seconds = (Date.now() - started) / 1000;
  if (typeof outcome === 'string') {
    console.log(`  skipped: ${outcome}`);
    results.push({ name, outcome: 'skipped', seconds, note: outcome });
  } else {
    results.push({ name, outcome: outcome ? 'passed' : 'failed', seconds });
  }
}

function testFiles(dir: string): string[] {
  const full = path.join(projectRoot, dir);
  if (!existsSync(full)) return [];
  return readdirSync(full).flatMap((entry) => {
    const relative = path.join(dir, entry);
    if (statSync(path.join(projectRoot, relative)).isDirectory()) return testFiles(relative);
    return entry.endsWith('.test.ts') ? [relative] : [];
  });
}

function hasAngularTestTarget(): boolean {
  const file = path.join(projectRoot, 'angular.json');
  if (!existsSync(file)) return false;
  const workspace = JSON.parse(readFileSync(file, 'utf8')) as { projects?: Record<string, { architect?: Record<string, unknown> }> };
  return Object.values(workspace.projects ?? {}).some((project) => project.architect?.test);
}

const bin = (name: string) => path.join(projectRoot, 'node_modules/.bin', name);

await stage('Type check (tsc -p tsconfig.node.json)', () => run('npm', ['run', '--silent', 'typecheck']));

await stage('Unit tests (test/unit)', async () => {
  const files = testFiles('test/unit');
  return files.length ? run(bin('mocha'), files) : 'no unit tests yet';
});

await stage('Web app unit tests (ng test)', async () =>
  hasAngularTestTarget() ? run(bin('ng'), ['test', '--watch=false'], { NG_CLI_ANALYTICS: 'false' }) : 'no Angular test target yet',
);

let webBuilt = true;
await stage('Web app build (when stale)', async () => {
  webBuilt = await buildWebIfStale(projectRoot, (line) => console.log(`  ${line}`));
  return webBuilt;
});

await stage('Integration and browser tests (throwaway PostgreSQL, Chromium)', async () => {
  const files = [...testFiles('test/integration'), ...(webBuilt ? testFiles('test/browser') : [])];
  if (!webBuilt) console.log('  browser tests left out: the web app did not build');
  return files.length ? run(bin('mocha'), ['--reporter', 'spec', ...files]) : 'no integration or browser tests yet';
});

heading('Summary');
for (const result of results) {
  const mark = result.outcome === 'passed' ? 'ok  ' : result.outcome === 'failed' ? 'FAIL' : 'skip';
  console.log(`  ${mark}  ${result.name.padEnd(66)} ${result.seconds.toFixed(1).padStart(6)} s`);
}
const failed = results.filter((result) => result.outcome === 'failed');
console.log(failed.length ? `\n  ${failed.length} stage(s) failed.\n` : '\n  All stages passed.\n');
process.exitCode = failed.length ? 1 : 0;

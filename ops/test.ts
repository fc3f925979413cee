/**
 * `npm test`: type check, unit tests, the web app's own unit tests, then integration and browser tests
 * against a throwaway PostgreSQL cluster (started by the mocha global setup in test/support). The web app is
 * built first when it is stale. Every stage runs even after a failure; the exit code is non-zero if any failed.
 * The very last line of the output is the plain count CI reads: `N passed, M failed` (and `, K skipped` when
 * tests were pending or skipped), summed over the mocha stages and `ng test`.
 */
import { spawn } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { projectRoot } from './dev-database.js';
import { buildWebIfStale } from './web-build.js';

interface TestCounts {
  passed: number;
  failed: number;
  skipped: number;
}

interface StageResult {
  name: string;
  outcome: 'passed' | 'failed' | 'skipped';
  seconds: number;
  note?: string;
  /** What the stage's test runner reported; null for stages that run no tests or died before reporting. */
  counts: TestCounts | null;
}

/** A stage's answer: success, a reason it was skipped, or success with the test counts its runner printed. */
type StageOutcome = boolean | string | { ok: boolean; counts: TestCounts | null };

const results: StageResult[] = [];

function heading(text: string): void {
  console.log(`\n━━ ${text} ${'━'.repeat(Math.max(0, 70 - text.length))}`);
}

/** Runs a child with its output streamed to this console as it comes, and kept for reading the counts. */
function run(command: string, args: string[], env: NodeJS.ProcessEnv = {}): Promise<{ ok: boolean; output: string }> {
  return new Promise((resolve) => {
    const child = spawn(command, args, { cwd: projectRoot, stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, ...env } });
    const chunks: string[] = [];
    const keep = (to: NodeJS.WriteStream) => (chunk: Buffer) => {
      to.write(chunk);
      chunks.push(chunk.toString('utf8'));
    };
    child.stdout.on('data', keep(process.stdout));
    child.stderr.on('data', keep(process.stderr));
    child.on('error', (error) => {
      console.error(`  could not run ${command}: ${error.message}`);
      resolve({ ok: false, output: chunks.join('') });
    });
    child.on('close', (code) => resolve({ ok: code === 0, output: chunks.join('') }));
  });
}

function plainLines(output: string): string[] {
  return output.replace(/\x1b\[[0-9;]*m/g, '').split(/\r?\n/);
}

/** mocha's summary: the last `N passing`, `N failing` and `N pending` lines; null when it printed none. */
function mochaCounts(output: string): TestCounts | null {
  const keys = { passing: 'passed', failing: 'failed', pending: 'skipped' } as const;
  const counts: TestCounts = { passed: 0, failed: 0, skipped: 0 };
  let found = false;
  for (const line of plainLines(output)) {
    const match = /^\s*(\d+) (passing|failing|pending)\b/.exec(line);
    if (!match) continue;
    counts[keys[match[2] as keyof typeof keys]] = Number(match[1]);
    found = true;
  }
  return found ? counts : null;
}

/** vitest's summary line, e.g. `Tests  2 failed | 19 passed | 1 skipped (22)`; null when it printed none. */
function vitestCounts(output: string): TestCounts | null {
  const line = plainLines(output).findLast((text) => /^\s*Tests\s+\d+ /.test(text));
  if (!line) return null;
  const counts: TestCounts = { passed: 0, failed: 0, skipped: 0 };
  for (const [, count, kind] of line.matchAll(/(\d+) (passed|failed|skipped|todo)\b/g)) {
    counts[kind === 'passed' || kind === 'failed' ? kind : 'skipped'] += Number(count);
  }
  return counts;
}

/** Runs a test runner and reads its counts from what it printed. */
async function testRun(command: string, args: string[], counts: (output: string) => TestCounts | null, env?: NodeJS.ProcessEnv): Promise<StageOutcome> {
  const { ok, output } = await run(command, args, env);
  return { ok, counts: counts(output) };
}

async function stage(name: string, body: () => Promise<StageOutcome>): Promise<void> {
  heading(name);
  const started = Date.now();
  const outcome = await body();
  const seconds = (Date.now() - started) / 1000;
  if (typeof outcome === 'string') {
    console.log(`  skipped: ${outcome}`);
    results.push({ name, outcome: 'skipped', seconds, note: outcome, counts: null });
  } else if (typeof outcome === 'boolean') {
    results.push({ name, outcome: outcome ? 'passed' : 'failed', seconds, counts: null });
  } else {
    results.push({ name, outcome: outcome.ok ? 'passed' : 'failed', seconds, counts: outcome.counts });
  }
}

/**
 * The closing line, summed over the stages. A failed stage that reported no failing test (a type error, a
 * broken build, a runner that died before its summary) counts as one failure, so a failing run never reads
 * "0 failed".
 */
function closingLine(stages: readonly StageResult[]): string {
  const total: TestCounts = { passed: 0, failed: 0, skipped: 0 };
  for (const result of stages) {
    const failed = result.counts?.failed ?? 0;
    total.passed += result.counts?.passed ?? 0;
    total.failed += result.outcome === 'failed' ? Math.max(1, failed) : failed;
    total.skipped += result.counts?.skipped ?? 0;
  }
  return `${total.passed} passed, ${total.failed} failed${total.skipped ? `, ${total.skipped} skipped` : ''}`;
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
// mocha writes into a pipe here, which turns its colours off; keep them when the run is watched in a terminal.
const mochaColor = process.stdout.isTTY ? ['--color'] : [];

await stage('Type check (tsc -p tsconfig.node.json)', async () => (await run('npm', ['run', '--silent', 'typecheck'])).ok);

await stage('Unit tests (test/unit)', async () => {
  const files = testFiles('test/unit');
  return files.length ? testRun(bin('mocha'), [...mochaColor, ...files], mochaCounts) : 'no unit tests yet';
});

await stage('Web app unit tests (ng test)', async () =>
  hasAngularTestTarget() ? testRun(bin('ng'), ['test', '--watch=false'], vitestCounts, { NG_CLI_ANALYTICS: 'false' }) : 'no Angular test target yet',
);

let webBuilt = true;
await stage('Web app build (when stale)', async () => {
  webBuilt = await buildWebIfStale(projectRoot, (line) => console.log(`  ${line}`));
  return webBuilt;
});

await stage('Integration and browser tests (throwaway PostgreSQL, Chromium)', async () => {
  const files = [...testFiles('test/integration'), ...(webBuilt ? testFiles('test/browser') : [])];
  if (!webBuilt) console.log('  browser tests left out: the web app did not build');
  return files.length ? testRun(bin('mocha'), [...mochaColor, '--reporter', 'spec', ...files], mochaCounts) : 'no integration or browser tests yet';
});

heading('Summary');
for (const result of results) {
  const mark = result.outcome === 'passed' ? 'ok  ' : result.outcome === 'failed' ? 'FAIL' : 'skip';
  const counts = result.counts ? `  ${result.counts.passed} passed, ${result.counts.failed} failed` : '';
  console.log(`  ${mark}  ${result.name.padEnd(66)} ${result.seconds.toFixed(1).padStart(6)} s${counts}`);
}
const failed = results.filter((result) => result.outcome === 'failed');
console.log(failed.length ? `\n  ${failed.length} stage(s) failed.\n` : '\n  All stages passed.\n');
process.exitCode = failed.length ? 1 : 0;
// The last line, with nothing after it: CI reads it.
console.log(closingLine(results));

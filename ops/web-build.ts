import { spawn } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

export type WebBuildState = 'no-web-app' | 'up-to-date' | 'missing' | 'stale';

/** Inputs of the Angular build: a change in any of them makes the built app stale. */
const buildInputs = ['web', 'shared', 'fonts', 'angular.json', 'tsconfig.json', 'package-lock.json'];

function newestChange(entry: string): number {
  if (!existsSync(entry)) return 0;
  const stat = statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const child of readdirSync(entry)) {
    if (child === 'node_modules' || child.startsWith('.')) continue;
    newest = Math.max(newest, newestChange(path.join(entry, child)));
  }
  return newest;
}

function builtIndex(root: string): string | null {
  for (const candidate of ['dist/web/browser/index.html', 'dist/web/index.html']) {
    const file = path.join(root, candidate);
    if (existsSync(file)) return file;
  }
  return null;
}

/** Whether dist/web has to be (re)built: missing, or older than any web source. */
export function webBuildState(root: string): WebBuildState {
  if (!existsSync(path.join(root, 'angular.json'))) return 'no-web-app';
  const index = builtIndex(root);
  if (!index) return 'missing';
  const builtAt = statSync(index).mtimeMs;
  return buildInputs.some((input) => newestChange(path.join(root, input)) > builtAt) ? 'stale' : 'up-to-date';
}

/** Runs `ng build` (production configuration) with its output on this console; resolves to its success. */
export function buildWeb(root: string): Promise<boolean> {
  return new Promise((resolve) => {
    const child = spawn(path.join(root, 'node_modules/.bin/ng'), ['build'], {
      cwd: root,
      stdio: ['ignore', 'inherit', 'inherit'],
      env: { ...process.env, NG_CLI_ANALYTICS: 'false' },
    });
    child.on('error', () => resolve(false));
    child.on('exit', (code) => resolve(code === 0));
  });
}

/**
 * Builds the web app when it is missing or stale. Returns false only when a build was needed and failed.
 * Without angular.json there is no web app yet: the server then shows a notice instead of the app.
 */
export async function buildWebIfStale(root: string, log: (line: string) => void): Promise<boolean> {
  const state = webBuildState(root);
  if (state === 'no-web-app') {
    log('No web app yet (angular.json is missing): the server will show a notice at / until it exists.');
    return true;
  }
  if (state === 'up-to-date') {
    log('Web app is built and up to date (dist/web).');
    return true;
  }
  log(state === 'missing' ? 'Building the web app (dist/web is missing)…' : 'Rebuilding the web app (sources changed since the last build)…');
  const ok = await buildWeb(root);
  log(ok ? 'Web app built.' : 'The web app build failed (see above).');
  return ok;
}

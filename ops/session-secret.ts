import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/**
 * The session secret for development: CONSERVA_SESSION_SECRET when set, else one generated once and kept in
 * the git-ignored .data/session-secret, so sign-ins survive a restart of npm start.
 */
export function developmentSessionSecret(root: string): string {
  if (process.env.CONSERVA_SESSION_SECRET) return process.env.CONSERVA_SESSION_SECRET;
  const file = path.join(root, '.data', 'session-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(path.dirname(file), { recursive: true });
  const secret = randomBytes(32).toString('hex');
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

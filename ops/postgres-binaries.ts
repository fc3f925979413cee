import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';

const debianRoot = '/usr/lib/postgresql';

/** The newest Debian PostgreSQL `bin` folder (holding initdb and pg_ctl), or null when none is installed. */
export function findPostgresBin(): string | null {
  if (!existsSync(debianRoot)) return null;
  const versions = readdirSync(debianRoot)
    .filter((v) => /^\d+$/.test(v) && existsSync(path.join(debianRoot, v, 'bin', 'initdb')))
    .sort((a, b) => Number(a) - Number(b));
  const newest = versions.at(-1);
  return newest ? path.join(debianRoot, newest, 'bin') : null;
}

/**
 * Finds the PostgreSQL binaries, installing Debian's `postgresql` package first when they are missing.
 * Installing needs root; otherwise the error says what to run.
 */
export function ensurePostgresBin(log: (line: string) => void): string {
  const found = findPostgresBin();
  if (found) return found;
  if (process.getuid?.() !== 0) {
    throw new Error(
      'PostgreSQL is not installed. Install it with `sudo apt-get install -y postgresql`, ' +
        'or set DATABASE_URL to use a PostgreSQL server of your own.',
    );
  }
  log('PostgreSQL binaries not found: installing the Debian package "postgresql" (apt-get)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '--no-install-recommends', 'postgresql'], { stdio: 'inherit', env });
  const installed = findPostgresBin();
  if (!installed) throw new Error(`apt-get installed postgresql but no initdb was found under ${debianRoot}.`);
  return installed;
}

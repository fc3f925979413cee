import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { chmodSync, chownSync, existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';

/** A private PostgreSQL cluster: one folder holding the data, the server log and the generated passwords. */
export interface ClusterSpec {
  /** Folder of the cluster; created when missing. The server's OS user must be able to reach it. */
  dir: string;
  /** Folder with initdb and pg_ctl (see findPostgresBin). */
  bin: string;
  port: number;
  database: string;
  role: string;
  /** Test clusters trade durability for speed (fsync off). */
  throwaway?: boolean;
}

export interface RunningCluster {
  url: string;
  port: number;
  /** False when the cluster was already running before this call. */
  startedNow: boolean;
}

interface Credentials {
  superuserPassword: string;
  appPassword: string;
}

const superuser = 'postgres';
const host = '127.0.0.1';

function runningAsRoot(): boolean {
  return process.getuid?.() === 0;
}

/** PostgreSQL refuses to run as root, so as root every server command runs as the `postgres` OS user. */
function runServerCommand(file: string, args: string[]): string {
  const [cmd, fullArgs] = runningAsRoot() ? ['runuser', ['-u', 'postgres', '--', file, ...args]] : [file, args];
  return execFileSync(cmd, fullArgs, { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
}

function dataDir(dir: string): string {
  return path.join(dir, 'data');
}

function logFile(dir: string): string {
  return path.join(dir, 'server.log');
}

function prepareFolder(dir: string): void {
  mkdirSync(dir, { recursive: true });
  if (!runningAsRoot()) return;
  const { uid, gid } = postgresOsUser();
  chownSync(dir, uid, gid);
  chmodSync(dir, 0o700);
  try {
    execFileSync('runuser', ['-u', 'postgres', '--', 'test', '-w', dir], { stdio: 'ignore' });
  } catch {
    throw new Error(
      `The postgres OS user cannot reach ${dir} (a parent folder is closed to it, e.g. /root). ` +
        'Choose another folder with CONSERVA_DB_DIR.',
    );
  }
}

function postgresOsUser(): { uid: number; gid: number } {
  const uid = Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim());
  const gid = Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim());
  return { uid, gid };
}

function credentialsFile(dir: string): string {
  return path.join(dir, 'credentials.json');
}

function readOrCreateCredentials(dir: string, initialized: boolean): Credentials {
  const file = credentialsFile(dir);
  if (existsSync(file)) return JSON.parse(readFileSync(file, 'utf8')) as Credentials;
  if (initialized) {
    throw new Error(`${file} is missing, so the cluster in ${dir} cannot be used. Stop it and delete the folder to start afresh.`);
  }
  const created: Credentials = {
    superuserPassword: randomBytes(18).toString('base64url'),
    appPassword: randomBytes(18).toString('base64url'),
  };
  writeFileSync(file, JSON.stringify(created, null, 2), { mode: 0o600 });
  return created;
}

function initializeCluster(spec: ClusterSpec, credentials: Credentials): void {
  // initdb reads the superuser password from a file the server's OS user can read; it is removed right after.
  const pwFile = path.join(spec.dir, 'initdb-password');
  writeFileSync(pwFile, credentials.superuserPassword, { mode: 0o600 });
  if (runningAsRoot()) {
    const { uid, gid } = postgresOsUser();
    chownSync(pwFile, uid, gid);
  }
  try {
    runServerCommand(path.join(spec.bin, 'initdb'), [
      '-D', dataDir(spec.dir), '-U', superuser, `--pwfile=${pwFile}`,
      '--auth-host=scram-sha-256', '--auth-local=scram-sha-256', '-E', 'UTF8', '--no-locale',
    ]);
  } finally {
    rmSync(pwFile, { force: true });
  }
}

/** The port a running cluster listens on, from its postmaster.pid (4th line), or null when it is not running. */
export function runningClusterPort(spec: Pick<ClusterSpec, 'dir' | 'bin'>): number | null {
  if (!existsSync(path.join(dataDir(spec.dir), 'PG_VERSION'))) return null;
  try {
    runServerCommand(path.join(spec.bin, 'pg_ctl'), ['-D', dataDir(spec.dir), 'status']);
  } catch {
    return null;
  }
  const pidFile = readFileSync(path.join(dataDir(spec.dir), 'postmaster.pid'), 'utf8').split('\n');
  return Number(pidFile[3]);
}

function serverOptions(spec: ClusterSpec): string {
  // No Unix socket: only TCP on loopback, so socket path limits and shared /tmp sockets never matter.
  const options = [`-p ${spec.port}`, `-c listen_addresses=${host}`, "-c unix_socket_directories=''"];
  if (spec.throwaway) {
    options.push('-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off', '-c max_connections=200');
  }
  return options.join(' ');
}

function startServer(spec: ClusterSpec): void {
  try {
    runServerCommand(path.join(spec.bin, 'pg_ctl'), [
      '-D', dataDir(spec.dir), '-l', logFile(spec.dir), '-w', '-t', '60', '-o', serverOptions(spec), 'start',
    ]);
  } catch (error) {
    throw new Error(`PostgreSQL did not start on ${host}:${spec.port}.\n${logTail(spec.dir)}`, { cause: error });
  }
}

function logTail(dir: string): string {
  try {
    return readFileSync(logFile(dir), 'utf8').split('\n').slice(-12).join('\n');
  } catch {
    return '(no server log)';
  }
}

async function ensureAppDatabase(spec: ClusterSpec, port: number, credentials: Credentials): Promise<void> {
  const client = new pg.Client({ host, port, user: superuser, password: credentials.superuserPassword, database: 'postgres' });
  await client.connect();
  try {
    const role = client.escapeIdentifier(spec.role);
    const roleExists = await client.query('select 1 from pg_roles where rolname = $1', [spec.role]);
    if (!roleExists.rowCount) await client.query(`create role ${role} login`);
    await client.query(`alter role ${role} login password ${client.escapeLiteral(credentials.appPassword)}`);
    const dbExists = await client.query('select 1 from pg_database where datname = $1', [spec.database]);
    if (!dbExists.rowCount) {
      await client.query(
        `create database ${client.escapeIdentifier(spec.database)} owner ${role} encoding 'UTF8' template template0`,
      );
    }
  } finally {
    await client.end();
  }
}

function connectionUrl(spec: ClusterSpec, port: number, credentials: Credentials): string {
  const password = encodeURIComponent(credentials.appPassword);
  return `postgres://${encodeURIComponent(spec.role)}:${password}@${host}:${port}/${encodeURIComponent(spec.database)}`;
}

/**
 * Initializes the cluster on first use, starts it unless it already runs, and makes sure the app's role and
 * database exist. Safe to call any number of times.
 */
export async function startCluster(spec: ClusterSpec): Promise<RunningCluster> {
  prepareFolder(spec.dir);
  const initialized = existsSync(path.join(dataDir(spec.dir), 'PG_VERSION'));
  const credentials = readOrCreateCredentials(spec.dir, initialized);
  if (!initialized) initializeCluster(spec, credentials);
  const alreadyOn = runningClusterPort(spec);
  if (alreadyOn === null) startServer(spec);
  const port = alreadyOn ?? spec.port;
  await ensureAppDatabase(spec, port, credentials);
  return { url: connectionUrl(spec, port, credentials), port, startedNow: alreadyOn === null };
}

/** Stops the cluster if it runs. Returns whether it was running. `immediate` skips the clean shutdown (tests). */
export function stopCluster(spec: Pick<ClusterSpec, 'dir' | 'bin'>, mode: 'fast' | 'immediate' = 'fast'): boolean {
  if (runningClusterPort(spec) === null) return false;
  runServerCommand(path.join(spec.bin, 'pg_ctl'), ['-D', dataDir(spec.dir), '-m', mode, '-w', 'stop']);
  return true;
}

import { createHash } from 'node:crypto';
import { lstatSync, mkdirSync, readlinkSync, realpathSync, rmSync, symlinkSync } from 'node:fs';
import path from 'node:path';
import { ensurePostgresBin, findPostgresBin } from './postgres-binaries.js';
import { startCluster, stopCluster, runningClusterPort, type ClusterSpec } from './pg-cluster.js';

export const projectRoot = path.resolve(import.meta.dirname, '..');
const defaultDbPort = 55432;

export interface DevDatabase {
  url: string;
  /** True when DATABASE_URL points at a server of the user's own and no private cluster is involved. */
  external: boolean;
  /** True when this call started the private cluster (so whoever called may stop it again). */
  startedNow: boolean;
}

function dbPort(): number {
  const raw = process.env.CONSERVA_DB_PORT;
  const port = raw ? Number(raw) : defaultDbPort;
  if (!Number.isInteger(port) || port < 1 || port > 65535) throw new Error(`CONSERVA_DB_PORT must be a port number, not "${raw}".`);
  return port;
}

/**
 * Where the development cluster lives. Run as a normal user it is `.pg/` in the checkout. Run as root, the
 * server runs as the `postgres` OS user, who often cannot enter the checkout (e.g. under /root), so the
 * cluster lives in /var/lib/conserva/<checkout name>-<hash of its path> and `.pg` is a link to it.
 */
export function devClusterDir(): string {
  if (process.env.CONSERVA_DB_DIR) return path.resolve(process.env.CONSERVA_DB_DIR);
  const link = path.join(projectRoot, '.pg');
  if (process.getuid?.() !== 0) return link;
  const checkout = realpathSync(projectRoot);
  const key = createHash('sha256').update(checkout).digest('hex').slice(0, 10);
  const target = path.join('/var/lib/conserva', `${path.basename(checkout)}-${key}`);
  pointLinkAt(link, target);
  return target;
}

function pointLinkAt(link: string, target: string): void {
  let current: string | null = null;
  try {
    const stat = lstatSync(link);
    if (!stat.isSymbolicLink()) {
      throw new Error(`${link} is a folder, but as root the cluster lives in ${target}. Move ${link} away and retry.`);
    }
    current = readlinkSync(link);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'ENOENT') throw error;
  }
  if (current === target) return;
  if (current !== null) rmSync(link);
  mkdirSync(target, { recursive: true });
  symlinkSync(target, link);
}

function devClusterSpec(bin: string): ClusterSpec {
  return { dir: devClusterDir(), bin, port: dbPort(), database: 'conserva', role: 'conserva' };
}

/** DATABASE_URL when set; otherwise the private development cluster, installed, initialized and started as needed. */
export async function startDevDatabase(log: (line: string) => void): Promise<DevDatabase> {
  if (process.env.DATABASE_URL) return { url: process.env.DATABASE_URL, external: true, startedNow: false };
  const spec = devClusterSpec(ensurePostgresBin(log));
  const running = await startCluster(spec);
  log(
    running.startedNow
      ? `PostgreSQL started on 127.0.0.1:${running.port} (data in ${spec.dir})`
      : `PostgreSQL already running on 127.0.0.1:${running.port} (data in ${spec.dir})`,
  );
  return { url: running.url, external: false, startedNow: running.startedNow };
}

/** Stops the private development cluster; does nothing when DATABASE_URL is set or it is not running. */
export function stopDevDatabase(): boolean {
  if (process.env.DATABASE_URL) return false;
  const bin = findPostgresBin();
  if (!bin) return false;
  return stopCluster(devClusterSpec(bin));
}

/** Port of the running development cluster, or null. */
export function devDatabasePort(): number | null {
  const bin = findPostgresBin();
  if (!bin || process.env.DATABASE_URL) return null;
  return runningClusterPort(devClusterSpec(bin));
}

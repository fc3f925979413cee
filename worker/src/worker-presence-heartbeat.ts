import os from 'node:os';
import type { MikroORM } from '@mikro-orm/postgresql';
import type { Logger } from 'pino';

const heartbeatMs = 10_000;

/** What a worker reports of itself. */
export interface WorkerReport {
  name: string;
  threads: number;
  shardSeconds: number;
  shardSubsets: number | null;
}

/**
 * Reports this worker (name, host, pid, threads, how it cuts shards) every 10 s, so estimates know the threads
 * at hand and the shards a sweep will get, and admins see who is running. Returns a stop function that removes
 * the report.
 */
export function startPresenceHeartbeat(orm: MikroORM, worker: WorkerReport, logger: Logger): () => Promise<void> {
  const em = orm.em.fork();
  const startedAt = new Date();
  const report = () =>
    em
      .execute(
        `insert into worker_presence (id, host, pid, threads, shard_seconds, shard_subsets, started_at, last_seen_at)
         values (?, ?, ?, ?, ?, ?, ?, now())
         on conflict (id) do update set host = excluded.host, pid = excluded.pid, threads = excluded.threads,
           shard_seconds = excluded.shard_seconds, shard_subsets = excluded.shard_subsets, last_seen_at = now()`,
        [worker.name, os.hostname(), process.pid, worker.threads, worker.shardSeconds, worker.shardSubsets, startedAt],
      )
      .catch((err: unknown) => logger.warn({ err }, 'could not report this worker'));
  void report();
  const timer = setInterval(() => void report(), heartbeatMs);
  return async () => {
    clearInterval(timer);
    await em.execute('delete from worker_presence where id = ?', [worker.name]).catch(() => undefined);
  };
}

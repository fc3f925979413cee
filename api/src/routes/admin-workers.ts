import type { MikroORM } from '@mikro-orm/postgresql';
import { Router } from 'express';
import type { WorkerList } from '../../../shared/schemas/worker-presence.js';
import { WorkerPresence } from '../entities/worker-presence.js';
import { workerAliveMs } from '../sweeps/measured-throughput.js';

/** /api/admin/workers: the worker processes that reported in, alive or not (newest report first). */
export function adminWorkersRouter(orm: MikroORM): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const now = Date.now();
    const workers = await orm.em.find(WorkerPresence, {}, { orderBy: { lastSeenAt: 'desc' }, limit: 200 });
    const body: WorkerList = {
      workers: workers.map((w) => ({
        id: w.id,
        host: w.host,
        pid: w.pid,
        threads: w.threads,
        startedAt: w.startedAt.toISOString(),
        lastSeenAt: w.lastSeenAt.toISOString(),
        alive: now - w.lastSeenAt.getTime() < workerAliveMs,
      })),
    };
    res.json(body);
  });
  return router;
}

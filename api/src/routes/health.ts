import { readFileSync } from 'node:fs';
import type { MikroORM } from '@mikro-orm/postgresql';
import { Router } from 'express';
import type { Health } from '../../../shared/schemas/health.js';

const version = (JSON.parse(readFileSync(new URL('../../../package.json', import.meta.url), 'utf8')) as { version: string }).version;
const probeTimeoutMs = 3000;

async function databaseAnswers(orm: MikroORM): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<false>((resolve) => {
    timer = setTimeout(() => resolve(false), probeTimeoutMs);
  });
  const probe = orm.em.getConnection().execute('select 1').then(() => true, () => false);
  try {
    return await Promise.race([probe, timeout]);
  } finally {
    clearTimeout(timer);
  }
}

/** /api/health: public; 200 when the database answers, 503 when it does not. */
export function healthRouter(orm: MikroORM): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const up = await databaseAnswers(orm);
    const body: Health = { status: up ? 'ok' : 'degraded', database: up ? 'up' : 'down', version };
    res.status(up ? 200 : 503).json(body);
  });
  return router;
}

import type { MikroORM } from '@mikro-orm/postgresql';
import { Router } from 'express';
import * as z from 'zod';
import type { AuditEventList } from '../../../shared/schemas/audit-event.js';
import { AuditEvent } from '../entities/audit-event.js';
import { HttpError } from '../http/http-error.js';
import { toAuditEventView } from '../services/admin-views.js';

const querySchema = z.object({
  limit: z.coerce.number().int().min(1).max(500).default(100),
  teamId: z.uuid().optional(),
});

/** /api/admin/audit-events: the newest audit events, optionally of one team. */
export function adminAuditEventsRouter(orm: MikroORM): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    const query = querySchema.safeParse(req.query);
    if (!query.success) throw new HttpError(400, 'bad_request', 'Use limit=1..500 and an optional teamId.');
    const { limit, teamId } = query.data;
    const events = await orm.em.find(AuditEvent, teamId ? { teamId } : {}, { orderBy: { createdAt: 'desc' }, limit });
    const body: AuditEventList = { events: events.map(toAuditEventView) };
    res.json(body);
  });
  return router;
}

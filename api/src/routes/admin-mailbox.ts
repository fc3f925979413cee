import type { MikroORM } from '@mikro-orm/postgresql';
import { Router } from 'express';
import * as z from 'zod';
import type { MailboxList, MailboxMessage } from '../../../shared/schemas/mailbox.js';
import { MailMessage } from '../entities/mail-message.js';
import { notFound } from '../http/http-error.js';
import { parseInput } from '../http/parse-body.js';
import { parseId } from '../http/parse-id.js';

const querySchema = z.object({
  limit: z.coerce.number().int().min(1).max(500).default(100),
  to: z.string().trim().toLowerCase().optional(),
});

function toMailboxMessage(message: MailMessage): MailboxMessage {
  return {
    id: message.id,
    receivedAt: message.receivedAt.toISOString(),
    from: message.sender,
    to: message.recipients,
    subject: message.subject,
    text: message.text,
    html: message.html ?? null,
  };
}

/** /api/admin/mailbox: what the local mailbox received, newest first (optionally to one address). */
export function adminMailboxRouter(orm: MikroORM): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    const { limit, to } = parseInput(querySchema, req.query);
    const where = to ? { recipients: { $contains: [to] } } : {};
    const messages = await orm.em.find(MailMessage, where, { orderBy: { receivedAt: 'desc' }, limit });
    const body: MailboxList = { messages: messages.map(toMailboxMessage) };
    res.json(body);
  });
  router.get('/:id', async (req, res) => {
    const message = await orm.em.findOne(MailMessage, { id: parseId(req.params.id, 'That message') });
    if (!message) throw notFound('That message');
    res.json(toMailboxMessage(message));
  });
  return router;
}

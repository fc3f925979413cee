import * as z from 'zod';

/*
 * The local mailbox (development and tests): an SMTP receiver on loopback that keeps every message it gets.
 *   GET /api/admin/mailbox[?limit=&to=]   -> mailboxListSchema, newest first (admins only)
 *   GET /api/admin/mailbox/:id            -> mailboxMessageSchema
 */
export const mailboxMessageSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
});
export type MailboxMessage = z.infer<typeof mailboxMessageSchema>;

export const mailboxListSchema = z.object({ messages: z.array(mailboxMessageSchema) });
export type MailboxList = z.infer<typeof mailboxListSchema>;

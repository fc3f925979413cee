import { randomUUID } from 'node:crypto';
import { defineEntity, type InferEntity } from '@mikro-orm/core';

const p = defineEntity.properties;

/** A message the local mailbox received (development and tests); admins read them in the app. */
export const MailMessage = defineEntity({
  name: 'MailMessage',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    receivedAt: p.datetime().onCreate(() => new Date()).index(),
    sender: p.string().length(320),
    recipients: p.json<string[]>(),
    subject: p.text(),
    text: p.text(),
    html: p.text().nullable(),
  },
});
export type MailMessage = InferEntity<typeof MailMessage>;

import type { AddressInfo } from 'node:net';
import type { MikroORM } from '@mikro-orm/postgresql';
import type { Logger } from 'pino';
import { SMTPServer } from 'smtp-server';
import { MailMessage } from '../entities/mail-message.js';
import { readMailContent } from './mail-text.js';

export interface Mailbox {
  port: number;
  close(): Promise<void>;
}

const maxMessageBytes = 5 * 1024 * 1024;

/**
 * The local mailbox: an SMTP server on loopback that accepts every message without authentication and keeps
 * it in the mail_message table, where admins read it in the app. For development and tests only; production
 * points CONSERVA_SMTP_URL at a real server.
 */
export async function startMailbox(orm: MikroORM, options: { host?: string; port: number; logger: Logger }): Promise<Mailbox> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: maxMessageBytes,
    logger: false,
    banner: 'Conserva local mailbox',
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const content = readMailContent(Buffer.concat(chunks).toString('latin1'));
        const em = orm.em.fork();
        em.create(MailMessage, {
          sender: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          recipients: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
          subject: content.subject,
          text: content.text,
          html: content.html,
        });
        em.flush().then(
          () => callback(),
          (err: Error) => {
            options.logger.error({ err }, 'the mailbox could not store a message');
            callback(err);
          },
        );
      });
    },
  });
  server.on('error', (err) => options.logger.warn({ err }, 'mailbox connection error'));
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, options.host ?? '127.0.0.1', () => resolve());
  });
  const address = (server as unknown as { server: { address(): AddressInfo } }).server.address();
  return {
    port: address.port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/**
 * The local mailbox process (`npm start` runs it in development): receives the app's e-mail over SMTP on
 * 127.0.0.1:CONSERVA_MAILBOX_PORT (default 2525) and keeps it for admins to read at /api/admin/mailbox.
 */
import { defaultMailboxPort, integerFrom } from '../api/src/config.js';
import { openOrm } from '../api/src/db/open-orm.js';
import { createLogger } from '../api/src/logger.js';
import { startMailbox } from '../api/src/mailbox/mailbox-server.js';

const databaseUrl = process.env.DATABASE_URL;
if (!databaseUrl) throw new Error('DATABASE_URL is not set (npm start sets it).');
const logger = createLogger(process.env.CONSERVA_LOG_LEVEL || 'info', 'mailbox');
const orm = await openOrm(databaseUrl, { poolMax: 2 });
const mailbox = await startMailbox(orm, { port: integerFrom(process.env, 'CONSERVA_MAILBOX_PORT', defaultMailboxPort, 1), logger });

async function stop(): Promise<void> {
  await mailbox.close();
  await orm.close();
  process.exit(0);
}
process.on('SIGINT', () => void stop());
process.on('SIGTERM', () => void stop());
logger.info({ port: mailbox.port }, `mailbox listening on smtp://127.0.0.1:${mailbox.port}`);

/** The API process: `node --import tsx api/src/main.ts` (npm start runs it with DATABASE_URL set). */
import { createServer } from 'node:http';
import { loadConfig } from './config.js';
import { createApp } from './app.js';
import { openOrm } from './db/open-orm.js';
import { pendingMigrations } from './db/migrate-database.js';
import { createLogger } from './logger.js';

const config = loadConfig();
const logger = createLogger(config.logLevel, 'api');

const orm = await openOrm(config.databaseUrl);
const pending = await pendingMigrations(orm);
if (pending.length) {
  logger.fatal({ pending }, 'the database lacks migrations; run `npm start` or `npm run db -- start` to apply them');
  await orm.close();
  process.exit(1);
}

const conserva = createApp(orm, config, logger);
const server = createServer(conserva.app);
conserva.attachLive(server);

let stopping = false;
async function stop(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'stopping');
  await conserva.closeLive();
  const forced = setTimeout(() => server.closeAllConnections(), 5000).unref();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  clearTimeout(forced);
  await conserva.close();
  await orm.close();
  process.exit(0);
}
// Handlers go in before the server announces itself: whoever reads that line may signal at once.
process.on('SIGINT', () => void stop('SIGINT'));
process.on('SIGTERM', () => void stop('SIGTERM'));

server.on('error', (err) => {
  logger.fatal({ err }, 'the server could not listen');
  process.exit(1);
});
server.listen(config.port, config.host, () => {
  logger.info({ url: `http://${config.host}:${config.port}/` }, `listening on http://${config.host}:${config.port}/`);
});

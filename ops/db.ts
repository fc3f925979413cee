/**
 * `npm run db -- <command>`: the private development PostgreSQL cluster by hand.
 *   start    install (Debian package) / initialize / start it, then apply migrations
 *   stop     stop it
 *   status   say whether it runs and where
 *   url      print the connection URL (starts it if needed)
 * With DATABASE_URL set, start and url use that server and stop does nothing.
 */
import { devClusterDir, devDatabasePort, startDevDatabase, stopDevDatabase } from './dev-database.js';

const log = (line: string) => console.error(line);
const command = process.argv[2] ?? 'status';

async function main(): Promise<number> {
  switch (command) {
    case 'start': {
      const database = await startDevDatabase(log);
      // Imported here so status and stop stay quick (the ORM is a heavy import).
      const { applyMigrationsAt } = await import('./apply-migrations.js');
      await applyMigrationsAt(database.url, log);
      return 0;
    }
    case 'stop':
      log(stopDevDatabase() ? 'PostgreSQL stopped.' : 'PostgreSQL was not running.');
      return 0;
    case 'status': {
      if (process.env.DATABASE_URL) {
        log('DATABASE_URL is set: the private cluster is not used.');
        return 0;
      }
      const port = devDatabasePort();
      log(port === null ? `Not running (data folder ${devClusterDir()}).` : `Running on 127.0.0.1:${port} (data folder ${devClusterDir()}).`);
      return port === null ? 3 : 0;
    }
    case 'url':
      console.log((await startDevDatabase(log)).url);
      return 0;
    default:
      log(`Unknown command "${command}". Use start, stop, status or url.`);
      return 2;
  }
}

process.exitCode = await main();

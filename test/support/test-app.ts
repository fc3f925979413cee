import { randomBytes } from 'node:crypto';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { MikroORM } from '@mikro-orm/postgresql';
import { createApp, type AppConfig } from '../../api/src/app.js';
import { allowanceDefaultsFrom } from '../../api/src/config.js';
import { openOrm } from '../../api/src/db/open-orm.js';
import type { AllowanceLimits } from '../../shared/schemas/allowance.js';
import { createLogger } from '../../api/src/logger.js';
import { testDatabaseUrl } from './test-database.js';

export interface TestAppOptions {
  /** Failed sign-ins allowed per address and e-mail per window (default 5 per minute, as in production). */
  loginLimit?: number;
  loginWindowMs?: number;
  /** Folder of a built web app to serve; default dist/web as in production (a notice page when absent). */
  webDir?: string;
  /** pino level; default from CONSERVA_TEST_LOG_LEVEL, else silent. */
  logLevel?: string;
  /** Largest recording upload (default 20 MB as in production). */
  uploadLimitBytes?: number;
  /** Limits new teams get (default as in production). */
  allowanceDefaults?: AllowanceLimits;
}

/** Limits far above what any test sweep needs, for tests that are not about allowances. */
export const generousAllowance: AllowanceLimits = { cpuSecondsPerMonth: 10_000_000, sweepsAtOnce: 50, subsetsPerSweep: 1e12 };

export interface TestApp {
  baseUrl: string;
  orm: MikroORM;
  close(): Promise<void>;
}

/** Starts the real Express app on 127.0.0.1 with a free port against the test database. */
export async function startTestApp(options: TestAppOptions = {}): Promise<TestApp> {
  const databaseUrl = testDatabaseUrl();
  const orm = await openOrm(databaseUrl, { poolMax: 5 });
  const config: AppConfig = {
    databaseUrl,
    sessionSecret: randomBytes(32).toString('hex'),
    webDir: options.webDir ?? null,
    loginLimit: options.loginLimit ?? 5,
    loginWindowMs: options.loginWindowMs ?? 60_000,
    trustProxy: false,
    https: false,
    uploadLimitBytes: options.uploadLimitBytes ?? 20 * 1024 * 1024,
    allowanceDefaults: options.allowanceDefaults ?? allowanceDefaultsFrom({}),
    publicUrl: 'http://127.0.0.1/',
  };
  const logger = createLogger(options.logLevel ?? process.env.CONSERVA_TEST_LOG_LEVEL ?? 'silent', 'api-test');
  const conserva = createApp(orm, config, logger);
  const server = createServer(conserva.app);
  conserva.attachLive(server);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    orm,
    async close() {
      await conserva.closeLive();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await conserva.close();
      await orm.close();
    },
  };
}

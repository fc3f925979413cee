import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import { createSweepQueues } from './sweep-jobs.js';

/**
 * pg-boss for the API: it only sends jobs (launch, cancel), so it neither supervises nor schedules. Started
 * on first use; the queues are created (idempotently) at that start.
 */
export class QueueClient {
  private started: Promise<PgBoss> | null = null;
  private boss: PgBoss | null = null;

  constructor(
    private readonly databaseUrl: string,
    private readonly logger: Logger,
  ) {}

  get(): Promise<PgBoss> {
    this.started ??= (async () => {
      const boss = new PgBoss({ connectionString: this.databaseUrl, max: 3, supervise: false, schedule: false });
      boss.on('error', (err) => this.logger.error({ err }, 'pg-boss error'));
      await boss.start();
      await createSweepQueues(boss);
      this.boss = boss;
      return boss;
    })();
    return this.started;
  }

  async close(): Promise<void> {
    if (!this.started) return;
    await this.started.catch(() => undefined);
    await this.boss?.stop({ graceful: false, wait: true, timeout: 5000 });
  }
}

import type { EntityManager } from '@mikro-orm/postgresql';
import type PgBoss from 'pg-boss';

/**
 * A pg-boss `db` that runs its SQL inside the entity manager's current transaction, so a job is enqueued
 * exactly when the change that calls for it commits (a sweep stored queued always has its prepare job; a
 * rolled-back launch leaves none). pg-boss writes `$1` placeholders; the ORM's driver takes `?`, so each
 * `$n` is turned into `?` with its value repeated in order.
 */
export function transactionDb(em: EntityManager): { executeSql(text: string, values: unknown[]): Promise<{ rows: Record<string, unknown>[] }> } {
  return {
    async executeSql(text: string, values: unknown[] = []) {
      const bindings: unknown[] = [];
      const sql = text.replace(/\$(\d+)/g, (_match, n: string) => {
        bindings.push(values[Number(n) - 1] ?? null);
        return '?';
      });
      const rows = await em.execute<Record<string, unknown>[]>(sql, bindings as never[]);
      return { rows };
    },
  };
}

/** Enqueues a job in the entity manager's current transaction; throws when pg-boss returns no id. */
export async function sendInTransaction(
  boss: PgBoss,
  em: EntityManager,
  queue: string,
  data: object,
  options: PgBoss.SendOptions = {},
): Promise<string> {
  const id = await boss.send(queue, data, { ...options, db: transactionDb(em) } as PgBoss.SendOptions);
  if (!id && !options.singletonKey) throw new Error(`pg-boss did not enqueue a job on ${queue} (does the queue exist?)`);
  return id ?? '';
}

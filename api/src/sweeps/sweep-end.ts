import type { EntityManager } from '@mikro-orm/postgresql';
import type PgBoss from 'pg-boss';
import type { UserRef } from '../../../shared/schemas/recording.js';
import type { SweepState } from '../../../shared/schemas/sweep.js';
import type { Sweep } from '../entities/sweep.js';
import { notifySweepEvent } from '../live/sweep-events.js';
import { sweepJobDefaults, sweepQueueNames } from '../queue/sweep-jobs.js';
import { sendInTransaction } from '../queue/transactional-send.js';

export interface SweepEnding {
  state: Exclude<SweepState, 'queued' | 'running'>;
  /** Why it failed or halted, for people. */
  reason?: string;
  cancelledBy?: UserRef;
}

/**
 * Puts a sweep in an end state inside the caller's transaction (which should hold the sweep's row lock):
 * queued shards are marked cancelled (their jobs find the sweep ended and do nothing), the launcher's e-mail
 * is enqueued, and the live hub hears of it when the transaction commits. The leaderboard stays as merged.
 */
export async function endSweep(tx: EntityManager, boss: PgBoss, sweep: Sweep, ending: SweepEnding): Promise<void> {
  const now = new Date();
  sweep.state = ending.state;
  sweep.endedAt = now;
  sweep.stateReason = ending.reason ?? null;
  if (ending.cancelledBy) {
    sweep.cancelledById = ending.cancelledBy.id;
    sweep.cancelledByName = ending.cancelledBy.name;
    sweep.cancelledAt = now;
  }
  await tx.flush();
  await tx.execute(`update shard set state = 'cancelled', ended_at = ? where sweep_id = ? and state = 'queued'`, [now, sweep.id]);
  await sendInTransaction(boss, tx, sweepQueueNames.ended, { kind: 'ended', sweepId: sweep.id }, sweepJobDefaults.ended);
  await notifySweepEvent(tx, { kind: 'state', sweepId: sweep.id, teamId: sweep.team.id, state: ending.state });
}

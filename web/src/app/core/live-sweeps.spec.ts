import type { LiveServerMessage } from '../../../../shared/schemas/live-message';
import type { SweepDetail, ShardSummary } from '../../../../shared/schemas/sweep';
import type { SweepLeaderboard } from '../../../../shared/schemas/sweep-leaderboard';
import { type LiveSweep, applyMessage } from './live-sweeps';

const shard = (index: number, state: ShardSummary['state']): ShardSummary => ({
  id: `shard-${index}`, index, slices: [], subsets: 5, state, attempts: 1, worker: null, evaluated: 0, rejected: 0, cpuSeconds: 0, startedAt: null, endedAt: null,
});
const detail = { id: 'sw', state: 'running', shards: [shard(0, 'queued'), shard(1, 'queued')], shardsDone: 0 } as unknown as SweepDetail;
const board = (version: number) => ({ sweepId: 'sw', version }) as unknown as SweepLeaderboard;
const empty: LiveSweep = { sweep: null, leaderboard: null, progress: null, problem: null };

describe('applyMessage', () => {
  it('starts from the state snapshot, then follows shards, leaderboard and the end', () => {
    let live = applyMessage(empty, { type: 'state', sweep: detail, leaderboard: board(1) } as LiveServerMessage);
    expect(live.leaderboard?.version).toBe(1);

    live = applyMessage(live, { type: 'shards', sweepId: 'sw', shards: [{ ...shard(1, 'running') }] });
    expect(live.sweep?.shards.map((s) => s.state)).toEqual(['queued', 'running']);

    live = applyMessage(live, { type: 'leaderboard', sweepId: 'sw', leaderboard: board(2) } as LiveServerMessage);
    expect(live.leaderboard?.version).toBe(2);

    live = applyMessage(live, { type: 'ended', sweepId: 'sw', sweep: { state: 'finished', shardsDone: 2 } } as unknown as LiveServerMessage);
    expect(live.sweep?.state).toBe('finished');
    expect(live.sweep?.shards).toHaveLength(2);
  });

  it('takes every planned shard from one message, and the shard and CPU counters from progress', () => {
    const queued = { id: 'sw', state: 'queued', shards: [], shardsDone: 0, shardCount: 0, cpuSeconds: 0 } as unknown as SweepDetail;
    let live = applyMessage(empty, { type: 'state', sweep: queued, leaderboard: board(0) } as LiveServerMessage);
    live = applyMessage(live, { type: 'shards', sweepId: 'sw', shards: [shard(1, 'queued'), shard(0, 'queued'), shard(2, 'queued')] });
    expect(live.sweep?.shards.map((s) => s.index)).toEqual([0, 1, 2]);

    live = applyMessage(live, { type: 'progress', sweepId: 'sw', state: 'running', shardsDone: 1, shardCount: 3, cpuSeconds: 4.5 } as LiveServerMessage);
    expect(live.sweep).toMatchObject({ shardsDone: 1, shardCount: 3, cpuSeconds: 4.5, state: 'queued' });
    expect(live.progress?.shardsDone).toBe(1);
  });

  it('keeps a refusal of the hub in words', () => {
    const live = applyMessage(empty, { type: 'error', sweepId: 'sw', code: 'not_found', message: 'That sweep does not exist.' });
    expect(live.problem).toBe('That sweep does not exist.');
  });
});

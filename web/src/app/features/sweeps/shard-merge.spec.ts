import type { ShardSummary } from '../../../../../shared/schemas/sweep';
import { mergeShards } from './shard-merge';

function shard(index: number, state: ShardSummary['state'], evaluated: number): ShardSummary {
  return {
    id: `s${index}`, index, slices: [{ size: 1, firstRank: 0, endRank: 10 }], subsets: 10, state, attempts: 1, worker: null,
    evaluated, rejected: 0, cpuSeconds: 0, startedAt: null, endedAt: null,
  };
}

describe('mergeShards', () => {
  it('keeps every shard once, in shard order, as the view that saw it further along', () => {
    const api = [shard(0, 'done', 10), shard(1, 'running', 4), shard(2, 'queued', 0)];
    const live = [shard(2, 'running', 1), shard(1, 'running', 2)];
    const merged = mergeShards(api, live);
    expect(merged.map((s) => [s.id, s.state, s.evaluated])).toEqual([
      ['s0', 'done', 10],
      ['s1', 'running', 4],
      ['s2', 'running', 1],
    ]);
  });
});

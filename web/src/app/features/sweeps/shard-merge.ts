import type { ShardState, ShardSummary } from '../../../../../shared/schemas/sweep';

const stateRank: Record<ShardState, number> = { queued: 0, running: 1, done: 2, cancelled: 2, failed: 2 };

/**
 * The shards of a sweep from two views of it (the API's answer and the live messages), each shard as the view
 * that saw it further along: later state first, then more subsets tried. In shard order.
 */
export function mergeShards(a: readonly ShardSummary[], b: readonly ShardSummary[]): ShardSummary[] {
  const merged = new Map(a.map((shard) => [shard.id, shard]));
  for (const shard of b) {
    const other = merged.get(shard.id);
    if (!other || isFurther(shard, other)) merged.set(shard.id, shard);
  }
  return [...merged.values()].sort((x, y) => x.index - y.index);
}

function isFurther(x: ShardSummary, y: ShardSummary): boolean {
  const rank = stateRank[x.state] - stateRank[y.state];
  return rank !== 0 ? rank > 0 : x.evaluated + x.rejected >= y.evaluated + y.rejected;
}

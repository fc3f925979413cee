import type { RankedSubset, SweepOutcome, SweepSlice } from './sweep-problem.js';

/**
 * Total order of leaderboard entries: lower RSS first, then fewer members, then members in lexicographic
 * order. Ties are broken by membership so that the kept entries do not depend on the order subsets were
 * seen in, which makes results identical however the rank space is split into shards.
 */
export function compareRankedSubsets(a: RankedSubset, b: RankedSubset): number {
  if (a.rss !== b.rss) return a.rss < b.rss ? -1 : 1;
  if (a.size !== b.size) return a.size - b.size;
  for (let i = 0; i < a.members.length; i++) {
    if (a.members[i] !== b.members[i]) return a.members[i] - b.members[i];
  }
  return 0;
}

/**
 * The best `capacity` subsets seen so far. A max-heap keyed by the order above keeps the worst kept entry
 * at the root, so memory is bounded by the capacity whatever the number of offers.
 */
export class Leaderboard {
  private readonly heap: RankedSubset[] = [];
  /**
   * RSS of the worst kept entry once the board is full, +Infinity before. A subset with a larger RSS can
   * never enter, so the hot loop compares against this plain number before calling `offer`.
   */
  threshold: number;

  constructor(readonly capacity: number) {
    if (!Number.isSafeInteger(capacity) || capacity < 0) {
      throw new RangeError(`leaderboard length must be a whole number of at least 0, got ${capacity}`);
    }
    this.threshold = capacity === 0 ? -Infinity : Infinity;
  }

  get length(): number {
    return this.heap.length;
  }

  /** Offers the subset made of the first `size` entries of `members`; copies them only when kept. */
  offer(rss: number, members: ArrayLike<number>, size: number): boolean {
    if (rss > this.threshold) return false;
    const copied = new Array<number>(size);
    for (let i = 0; i < size; i++) copied[i] = members[i];
    return this.add({ size, members: copied, rss });
  }

  /** Adds an entry (kept as given, not copied) when it beats the worst kept one. */
  add(entry: RankedSubset): boolean {
    if (this.capacity === 0) return false;
    const heap = this.heap;
    if (heap.length < this.capacity) {
      heap.push(entry);
      this.siftUp(heap.length - 1);
    } else {
      if (compareRankedSubsets(entry, heap[0]) >= 0) return false;
      heap[0] = entry;
      this.siftDown(0);
    }
    if (heap.length === this.capacity) this.threshold = heap[0].rss;
    return true;
  }

  /** Kept entries, best first. */
  sorted(): RankedSubset[] {
    return [...this.heap].sort(compareRankedSubsets);
  }

  private siftUp(position: number): void {
    const heap = this.heap;
    while (position > 0) {
      const parent = (position - 1) >> 1;
      if (compareRankedSubsets(heap[position], heap[parent]) <= 0) return;
      [heap[position], heap[parent]] = [heap[parent], heap[position]];
      position = parent;
    }
  }

  private siftDown(position: number): void {
    const heap = this.heap;
    for (;;) {
      const left = 2 * position + 1;
      const right = left + 1;
      let worst = position;
      if (left < heap.length && compareRankedSubsets(heap[left], heap[worst]) > 0) worst = left;
      if (right < heap.length && compareRankedSubsets(heap[right], heap[worst]) > 0) worst = right;
      if (worst === position) return;
      [heap[position], heap[worst]] = [heap[worst], heap[position]];
      position = worst;
    }
  }
}

/** The best `top` of several lists of entries, best first; an entry listed twice is kept once. */
export function mergeRankedSubsets(lists: readonly (readonly RankedSubset[])[], top: number): RankedSubset[] {
  const board = new Leaderboard(top);
  const seen = new Set<string>();
  for (const list of lists) {
    for (const entry of list) {
      const key = `${entry.size}:${entry.members.join(',')}`;
      if (seen.has(key)) continue;
      seen.add(key);
      board.add(entry);
    }
  }
  return board.sorted();
}

/**
 * Combines the outcomes of sweeps over disjoint slices (shards) into the outcome one sweep over all of them
 * would have given: counts add up, leaderboards merge under the same total order.
 */
export function mergeSweepOutcomes(outcomes: readonly SweepOutcome[], top: number): SweepOutcome {
  const sizes = new Set<number>();
  for (const outcome of outcomes) for (const size of Object.keys(outcome.bestBySize)) sizes.add(Number(size));
  const bestBySize: Record<number, RankedSubset[]> = {};
  for (const size of [...sizes].sort((a, b) => a - b)) {
    bestBySize[size] = mergeRankedSubsets(outcomes.map((outcome) => outcome.bestBySize[size] ?? []), top);
  }
  const remaining: SweepSlice[] = outcomes.flatMap((outcome) => outcome.remaining ?? []);
  return {
    evaluated: outcomes.reduce((sum, outcome) => sum + outcome.evaluated, 0),
    rejected: outcomes.reduce((sum, outcome) => sum + outcome.rejected, 0),
    stopped: outcomes.some((outcome) => outcome.stopped),
    best: mergeRankedSubsets(outcomes.map((outcome) => outcome.best), top),
    bestBySize,
    remaining,
  };
}

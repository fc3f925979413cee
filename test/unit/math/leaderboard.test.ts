import { expect } from 'chai';
import { compareRankedSubsets, Leaderboard, mergeSweepOutcomes } from '../../../shared/math/leaderboard.js';
import type { RankedSubset, SweepOutcome } from '../../../shared/math/sweep-problem.js';
import { createSeededRandom } from '../../../shared/math/seeded-random.js';

function randomEntries(count: number, seed: number, distinctRss: number): RankedSubset[] {
  const uniform = createSeededRandom(seed);
  return Array.from({ length: count }, (_, i) => ({
    size: 2,
    members: [i % 17, 17 + i],
    // Few distinct values, so that many entries tie on RSS and the member order has to decide.
    rss: Math.floor(uniform() * distinctRss) / 8,
  }));
}

function shuffled<T>(items: T[], seed: number): T[] {
  const uniform = createSeededRandom(seed);
  const copy = [...items];
  for (let i = copy.length - 1; i > 0; i--) {
    const j = Math.floor(uniform() * (i + 1));
    [copy[i], copy[j]] = [copy[j], copy[i]];
  }
  return copy;
}

describe('leaderboard: bounded best-K by RSS', () => {
  it('keeps exactly the K best of many offers, as a full sort would (Array.prototype.sort as reference)', () => {
    const entries = randomEntries(5000, 1, 1000);
    const board = new Leaderboard(25);
    for (const entry of entries) {
      board.add(entry);
      expect(board.length).to.be.at.most(25);
    }
    expect(board.sorted()).to.deep.equal([...entries].sort(compareRankedSubsets).slice(0, 25));
  });

  it('breaks RSS ties by size, then members, so the order of offers does not matter', () => {
    const entries = randomEntries(2000, 2, 40);
    const expected = [...entries].sort(compareRankedSubsets).slice(0, 30);
    for (const seed of [3, 4, 5]) {
      const board = new Leaderboard(30);
      for (const entry of shuffled(entries, seed)) board.add(entry);
      expect(board.sorted()).to.deep.equal(expected);
    }
    expect(compareRankedSubsets({ size: 1, members: [9], rss: 1 }, { size: 2, members: [0, 1], rss: 1 })).to.be.lessThan(0);
    expect(compareRankedSubsets({ size: 2, members: [0, 5], rss: 1 }, { size: 2, members: [1, 2], rss: 1 })).to.be.lessThan(0);
  });

  it('reports +Infinity as threshold until full, then the worst kept RSS', () => {
    const board = new Leaderboard(3);
    expect(board.threshold).to.equal(Infinity);
    board.offer(5, [1], 1);
    board.offer(2, [2], 1);
    expect(board.threshold).to.equal(Infinity);
    board.offer(9, [3], 1);
    expect(board.threshold).to.equal(9);
    expect(board.offer(10, [4], 1)).to.equal(false);
    expect(board.offer(1, [5], 1)).to.equal(true);
    expect(board.threshold).to.equal(5);
    expect(board.sorted().map((entry) => entry.members[0])).to.deep.equal([5, 2, 1]);
  });

  it('copies only the first `size` members when it keeps an offer', () => {
    const members = new Int32Array([4, 7, 9, 11]);
    const board = new Leaderboard(2);
    board.offer(1.5, members, 2);
    members[0] = 0;
    expect(board.sorted()).to.deep.equal([{ size: 2, members: [4, 7], rss: 1.5 }]);
  });

  it('keeps nothing with length 0', () => {
    const board = new Leaderboard(0);
    expect(board.offer(0, [1], 1)).to.equal(false);
    expect(board.sorted()).to.deep.equal([]);
  });

  it('merges outcomes of disjoint shards into the outcome of one board over everything', () => {
    const entries = randomEntries(600, 6, 50);
    const top = 10;
    const shards: SweepOutcome[] = [0, 1, 2].map((shard) => {
      const board = new Leaderboard(top);
      const mine = entries.filter((_, i) => i % 3 === shard);
      for (const entry of mine) board.add(entry);
      return { evaluated: mine.length, rejected: shard, stopped: false, best: board.sorted(), bestBySize: { 2: board.sorted() }, remaining: [] };
    });
    const merged = mergeSweepOutcomes(shards, top);
    const expected = [...entries].sort(compareRankedSubsets).slice(0, top);
    expect(merged.best).to.deep.equal(expected);
    expect(merged.bestBySize[2]).to.deep.equal(expected);
    expect(merged.evaluated).to.equal(600);
    expect(merged.rejected).to.equal(0 + 1 + 2);
    expect(merged.stopped).to.equal(false);
  });
});

import { expect } from 'chai';
import {
  binomial,
  countSliceSubsets,
  countSubsets,
  countSubsetsBySize,
  partitionSlices,
  rankSubset,
  splitRankSpace,
  unrankSubset,
} from '../../../shared/math/combinations.js';
import type { SweepSlice } from '../../../shared/math/sweep-problem.js';

/** Independent check: n! / (k! (n-k)!) as a product of BigInts. */
function binomialByFactorials(n: number, k: number): bigint {
  const factorial = (x: number): bigint => {
    let product = 1n;
    for (let i = 2n; i <= BigInt(x); i++) product *= i;
    return product;
  };
  return factorial(n) / (factorial(k) * factorial(n - k));
}

/** Independent enumeration of k-subsets of {0..n-1} in lexicographic order, by recursion. */
function subsetsInLexicographicOrder(n: number, k: number): number[][] {
  const result: number[][] = [];
  const extend = (prefix: number[], next: number): void => {
    if (prefix.length === k) {
      result.push(prefix);
      return;
    }
    for (let member = next; member <= n - (k - prefix.length); member++) extend([...prefix, member], member + 1);
  };
  extend([], 0);
  return result;
}

function compareLexicographically(a: number[], b: number[]): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return 0;
}

describe('combinations: subset counts and ranks', () => {
  // Knuth, TAOCP 4A, 7.2.1.3 (combinatorial number system); values from memory, cross-checked by factorials.
  for (const [n, k, expected] of [
    [40, 4, 91390],
    [60, 4, 487635],
    [52, 5, 2598960],
  ] as const) {
    it(`C(${n}, ${k}) = ${expected} (Knuth TAOCP 4A 7.2.1.3, from memory; checked against n!/(k!(n-k)!))`, () => {
      expect(binomial(n, k)).to.equal(expected);
      expect(BigInt(binomial(n, k))).to.equal(binomialByFactorials(n, k));
    });
  }

  it('agrees with the factorial formula for every n up to 70, and refuses counts past 2^53 - 1', () => {
    for (let n = 0; n <= 70; n++) {
      for (let k = 0; k <= n; k++) {
        const exact = binomialByFactorials(n, k);
        if (exact > BigInt(Number.MAX_SAFE_INTEGER)) {
          expect(() => binomial(n, k), `C(${n}, ${k})`).to.throw(RangeError, /cannot be counted exactly/);
        } else {
          expect(BigInt(binomial(n, k)), `C(${n}, ${k})`).to.equal(exact);
        }
      }
    }
  });

  it('is zero outside 0 <= k <= n', () => {
    expect(binomial(5, 6)).to.equal(0);
    expect(binomial(5, -1)).to.equal(0);
  });

  it('unrank enumerates every k-subset in lexicographic order, and rank inverts it (all n <= 9)', () => {
    for (let n = 0; n <= 9; n++) {
      for (let k = 0; k <= n; k++) {
        const expected = subsetsInLexicographicOrder(n, k);
        expect(binomial(n, k)).to.equal(expected.length);
        expected.forEach((subset, rank) => {
          expect(unrankSubset(rank, n, k), `unrank(${rank}, ${n}, ${k})`).to.deep.equal(subset);
          expect(rankSubset(subset, n), `rank([${subset}], ${n})`).to.equal(rank);
        });
        for (let rank = 1; rank < expected.length; rank++) {
          expect(compareLexicographically(unrankSubset(rank - 1, n, k), unrankSubset(rank, n, k))).to.be.lessThan(0);
        }
      }
    }
  });

  it('round-trips ranks of large spaces (sampled ranks of 6-subsets of 60)', () => {
    const total = binomial(60, 6);
    for (const rank of [0, 1, 59, 1234567, Math.floor(total / 2), total - 2, total - 1]) {
      const members = unrankSubset(rank, 60, 6);
      expect(members).to.have.length(6);
      expect(rankSubset(members, 60)).to.equal(rank);
    }
    expect(unrankSubset(0, 60, 6)).to.deep.equal([0, 1, 2, 3, 4, 5]);
    expect(unrankSubset(total - 1, 60, 6)).to.deep.equal([54, 55, 56, 57, 58, 59]);
  });

  it('rejects ranks outside the space and members that are not ascending', () => {
    expect(() => unrankSubset(binomial(10, 3), 10, 3)).to.throw(RangeError);
    expect(() => unrankSubset(-1, 10, 3)).to.throw(RangeError);
    expect(() => rankSubset([3, 2], 10)).to.throw(RangeError);
    expect(() => rankSubset([1, 10], 10)).to.throw(RangeError);
  });

  it('counts subsets per size of a size range', () => {
    expect(countSubsetsBySize(12, 0, 3)).to.deep.equal([
      { size: 0, count: 1 },
      { size: 1, count: 12 },
      { size: 2, count: 66 },
      { size: 3, count: 220 },
    ]);
    // Sum over all sizes of C(n, k) is 2^n (binomial theorem).
    expect(countSubsets(20, 0, 20)).to.equal(2 ** 20);
  });
});

describe('combinations: slices of the rank space', () => {
  function expectExactCover(slices: SweepSlice[], n: number, minSize: number, maxSize: number): void {
    const covered = new Map<number, number>();
    for (const slice of slices) {
      expect(slice.endRank).to.be.greaterThan(slice.firstRank);
      // Contiguous and in order within a size: each slice starts where the previous one of its size ended.
      expect(slice.firstRank).to.equal(covered.get(slice.size) ?? 0);
      covered.set(slice.size, slice.endRank);
    }
    for (let size = minSize; size <= maxSize; size++) {
      expect(covered.get(size) ?? 0, `size ${size}`).to.equal(binomial(n, size));
    }
  }

  it('covers every size exactly once, in slices of about the asked length', () => {
    for (const perSlice of [1, 7, 50, 1000]) {
      const slices = splitRankSpace(10, 0, 5, perSlice);
      expectExactCover(slices, 10, 0, 5);
      for (const slice of slices) expect(slice.endRank - slice.firstRank).to.be.at.most(perSlice);
      expect(countSliceSubsets(slices)).to.equal(countSubsets(10, 0, 5));
    }
  });

  it('leaves out sizes that have no subsets', () => {
    const slices = splitRankSpace(3, 2, 5, 10);
    expect(slices).to.deep.equal([
      { size: 2, firstRank: 0, endRank: 3 },
      { size: 3, firstRank: 0, endRank: 1 },
    ]);
  });

  it('partitions slices into groups of nearly equal work that still cover the space exactly once', () => {
    const slices = splitRankSpace(14, 1, 4, 100);
    const total = countSliceSubsets(slices);
    for (const parts of [1, 2, 3, 7, 64]) {
      const groups = partitionSlices(slices, parts);
      expect(groups.length).to.be.at.most(parts);
      const sizes = groups.map(countSliceSubsets);
      expect(Math.max(...sizes) - Math.min(...sizes)).to.be.at.most(1);
      const flattened = groups.flat();
      expectExactCover(flattened, 14, 1, 4);
      expect(countSliceSubsets(flattened)).to.equal(total);
    }
  });
});

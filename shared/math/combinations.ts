import type { SweepSlice } from './sweep-problem.js';

/*
 * Subsets of {0..n-1} with k members are ranked in lexicographic order of their ascending index tuples
 * ({0,1,2} has rank 0, then {0,1,3}, ...), which is the order the sweep kernel enumerates them in. Ranks are
 * computed with the combinatorial number system (Knuth, TAOCP 4A, 7.2.1.3): the co-lexicographic rank of
 * b_1 < ... < b_k is sum_i C(b_i, i), and the lexicographic rank of a subset is C(n, k) - 1 minus the
 * co-lexicographic rank of its mirror image b = {n-1-a}.
 */

/** One size of a sweep and how many subsets of that size there are. */
export interface SubsetCount {
  size: number;
  count: number;
}

function greatestCommonDivisor(a: number, b: number): number {
  while (b !== 0) {
    const rest = a % b;
    a = b;
    b = rest;
  }
  return a;
}

function assertCount(value: number, what: string): void {
  if (!Number.isSafeInteger(value) || value < 0) {
    throw new RangeError(`${what} must be a non-negative whole number, got ${value}`);
  }
}

/**
 * The binomial coefficient C(n, k), exact. Throws a RangeError when the count exceeds
 * Number.MAX_SAFE_INTEGER, since beyond that ranks could no longer be represented exactly.
 */
export function binomial(n: number, k: number): number {
  assertCount(n, 'n');
  if (!Number.isInteger(k) || k < 0 || k > n) return 0;
  const smaller = Math.min(k, n - k);
  let value = 1;
  for (let i = 1; i <= smaller; i++) {
    // value = C(n - smaller + i - 1, i - 1); i divides value * (n - smaller + i), so after removing the
    // common factor g, i / g divides the second factor and both factors stay whole numbers.
    const g = greatestCommonDivisor(value, i);
    const next = (value / g) * ((n - smaller + i) / (i / g));
    if (next > Number.MAX_SAFE_INTEGER) {
      throw new RangeError(`C(${n}, ${k}) exceeds ${Number.MAX_SAFE_INTEGER} and cannot be counted exactly`);
    }
    value = next;
  }
  return value;
}

function assertSubset(members: ArrayLike<number>, n: number): void {
  for (let j = 0; j < members.length; j++) {
    const member = members[j];
    const previous = j === 0 ? -1 : members[j - 1];
    if (!Number.isInteger(member) || member <= previous || member >= n) {
      throw new RangeError(`members must be ascending whole numbers in 0..${n - 1}, got [${Array.from(members).join(', ')}]`);
    }
  }
}

/** Lexicographic rank of an ascending k-subset of {0..n-1} among all k-subsets. */
export function rankSubset(members: ArrayLike<number>, n: number): number {
  assertSubset(members, n);
  const k = members.length;
  let colexOfMirror = 0;
  for (let j = 0; j < k; j++) colexOfMirror += binomial(n - 1 - members[j], k - j);
  return binomial(n, k) - 1 - colexOfMirror;
}

/**
 * Writes the k-subset of {0..n-1} with the given lexicographic rank into `out[0..k-1]`, ascending.
 * The greedy step of the combinatorial number system picks the largest mirrored element first.
 */
export function unrankSubsetInto(rank: number, n: number, k: number, out: { [index: number]: number }): void {
  const total = binomial(n, k);
  if (!Number.isSafeInteger(rank) || rank < 0 || rank >= total) {
    throw new RangeError(`rank ${rank} is outside 0..${total - 1} for subsets of size ${k} of ${n}`);
  }
  let colex = total - 1 - rank;
  let member = 0;
  for (let j = 0; j < k; j++) {
    const remainingSize = k - j;
    // Largest mirrored value b = n-1-member with C(b, remainingSize) <= colex, i.e. the smallest member.
    while (binomial(n - 1 - member, remainingSize) > colex) member++;
    out[j] = member;
    colex -= binomial(n - 1 - member, remainingSize);
    member++;
  }
}

/** The k-subset of {0..n-1} with the given lexicographic rank, ascending. */
export function unrankSubset(rank: number, n: number, k: number): number[] {
  const members = new Array<number>(k);
  unrankSubsetInto(rank, n, k, members);
  return members;
}

function assertSizeRange(n: number, minSize: number, maxSize: number): void {
  assertCount(n, 'candidate count');
  assertCount(minSize, 'smallest subset size');
  assertCount(maxSize, 'largest subset size');
  if (minSize > maxSize) throw new RangeError(`smallest subset size ${minSize} exceeds largest ${maxSize}`);
}

/** How many subsets of each size in minSize..maxSize a sweep over n candidates has. */
export function countSubsetsBySize(n: number, minSize: number, maxSize: number): SubsetCount[] {
  assertSizeRange(n, minSize, maxSize);
  const counts: SubsetCount[] = [];
  for (let size = minSize; size <= maxSize; size++) counts.push({ size, count: binomial(n, size) });
  return counts;
}

/** Total number of subsets of sizes minSize..maxSize of n candidates (exact; throws past 2^53 - 1). */
export function countSubsets(n: number, minSize: number, maxSize: number): number {
  const total = countSubsetsBySize(n, minSize, maxSize).reduce((sum, { count }) => sum + count, 0);
  if (total > Number.MAX_SAFE_INTEGER) throw new RangeError(`the sweep has more than ${Number.MAX_SAFE_INTEGER} subsets`);
  return total;
}

/** Number of subsets a list of slices covers. */
export function countSliceSubsets(slices: readonly SweepSlice[]): number {
  let total = 0;
  for (const slice of slices) total += slice.endRank - slice.firstRank;
  return total;
}

/**
 * Splits the rank space of sizes minSize..maxSize into contiguous slices of about `subsetsPerSlice` subsets
 * (sizes are cut into equal pieces; a slice never spans two sizes), in order of size then rank.
 */
export function splitRankSpace(n: number, minSize: number, maxSize: number, subsetsPerSlice: number): SweepSlice[] {
  if (!Number.isSafeInteger(subsetsPerSlice) || subsetsPerSlice < 1) {
    throw new RangeError(`subsets per slice must be a whole number of at least 1, got ${subsetsPerSlice}`);
  }
  const slices: SweepSlice[] = [];
  for (const { size, count } of countSubsetsBySize(n, minSize, maxSize)) {
    if (count === 0) continue;
    const pieces = Math.ceil(count / subsetsPerSlice);
    for (let piece = 0; piece < pieces; piece++) {
      slices.push({ size, firstRank: pieceStart(count, pieces, piece), endRank: pieceStart(count, pieces, piece + 1) });
    }
  }
  return slices;
}

/** Start of piece `piece` when `count` items are cut into `pieces` nearly equal pieces (exact for safe counts). */
function pieceStart(count: number, pieces: number, piece: number): number {
  const base = Math.floor(count / pieces);
  const extra = count - base * pieces;
  return piece * base + Math.min(piece, extra);
}

/**
 * Cuts a list of slices into `parts` groups covering about the same number of subsets each, splitting slices
 * where needed and keeping their order. Groups that would be empty are left out.
 */
export function partitionSlices(slices: readonly SweepSlice[], parts: number): SweepSlice[][] {
  if (!Number.isSafeInteger(parts) || parts < 1) throw new RangeError(`parts must be a whole number of at least 1, got ${parts}`);
  const total = countSliceSubsets(slices);
  const groups: SweepSlice[][] = [];
  const queue = slices.filter((slice) => slice.endRank > slice.firstRank).map((slice) => ({ ...slice }));
  let next = 0;
  for (let part = 0; part < parts && next < queue.length; part++) {
    let wanted = pieceStart(total, parts, part + 1) - pieceStart(total, parts, part);
    const group: SweepSlice[] = [];
    while (wanted > 0 && next < queue.length) {
      const head = queue[next];
      const available = head.endRank - head.firstRank;
      if (available <= wanted) {
        group.push(head);
        next++;
        wanted -= available;
      } else {
        group.push({ size: head.size, firstRank: head.firstRank, endRank: head.firstRank + wanted });
        head.firstRank += wanted;
        wanted = 0;
      }
    }
    if (group.length > 0) groups.push(group);
  }
  return groups;
}

import { createSeededRandom } from '../../../shared/math/seeded-random.js';

/** A state of a mechanism with its generalized forces. */
export interface State {
  q: number[];
  dq: number[];
  u: number[];
}

export interface StateRanges {
  /** Range of the first coordinate (keeps a spherical pendulum off its coordinate pole); default [-q, q]. */
  first?: [number, number];
  /** Half-widths of the uniform ranges of the other coordinates, the velocities and the forces. */
  q?: number;
  dq?: number;
  u?: number;
}

/** Reproducible random states (our seeded generator), uniform in a box: for comparing equations pointwise. */
export function randomStates(n: number, count: number, seed: number, ranges: StateRanges = {}): State[] {
  const { q = 2, dq = 3, u = 1 } = ranges;
  const first = ranges.first ?? [-q, q];
  const random = createSeededRandom(seed);
  const between = (a: number, b: number) => a + (b - a) * random();
  return Array.from({ length: count }, () => ({
    q: Array.from({ length: n }, (_, i) => (i === 0 ? between(...first) : between(-q, q))),
    dq: Array.from({ length: n }, () => between(-dq, dq)),
    u: Array.from({ length: n }, () => between(-u, u)),
  }));
}

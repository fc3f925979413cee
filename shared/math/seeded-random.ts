/**
 * Reproducible pseudo-random numbers for simulated data and noise draws: mulberry32 (a small public-domain
 * 32-bit generator) for uniforms, and the Box-Muller transform for standard normal deviates. The same seed
 * gives the same sequence on every run and platform. Not for anything secret.
 */

/** Uniform numbers in [0, 1), the whole sequence fixed by the seed. */
export function createSeededRandom(seed: number): () => number {
  if (!Number.isInteger(seed)) throw new RangeError(`createSeededRandom: the seed must be an integer, got ${seed}`);
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 15), z | 1);
    z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
    return ((z ^ (z >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal numbers (mean 0, standard deviation 1) from a uniform generator, by Box-Muller. */
export function createNormalRandom(uniform: () => number): () => number {
  return () => {
    const u = 1 - uniform(); // in (0, 1], so the logarithm is finite
    const v = uniform();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  };
}

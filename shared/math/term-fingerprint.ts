import type { CandidateTerm } from './candidate-term.js';
import { createSeededRandom } from './seeded-random.js';
import { sampleColumns } from './term-compiler.js';
import type { TermSymbols } from './term-symbols.js';

const PROBE_COUNT = 8;
const PROBE_SEED = 4111;
const SIGNIFICANT_DIGITS = 9;

/**
 * A key that two terms share exactly when one is a constant multiple of the other as functions
 * (`dph^2*sin(th)^2` and `sin(th)^2*dph^2`, or `2*dx^2` and `dx^2`): the term's values at fixed pseudo-random
 * states, divided by the largest of them and rounded. Such terms give proportional columns on any data, so
 * only one of them can ever be in a model; a candidate proportional to the reference term would even cancel
 * it and fit a zero energy. Null when the term is not finite at a probe state (no comparison is made).
 */
export function termFingerprint(term: CandidateTerm, symbols: TermSymbols): string | null {
  const random = createSeededRandom(PROBE_SEED);
  const names = [...symbols.coordinates, ...symbols.velocities];
  const columns = Object.fromEntries(names.map((name) => [name, Float64Array.from({ length: PROBE_COUNT }, () => 4 * random() - 2)]));
  const values = term.value(sampleColumns(columns, PROBE_COUNT));
  if (!values.every(Number.isFinite)) return null;
  let largest = 0;
  for (const v of values) if (Math.abs(v) > Math.abs(largest)) largest = v;
  if (largest === 0) return null;
  return Array.from(values, (v) => (v / largest).toPrecision(SIGNIFICANT_DIGITS)).join(',');
}

import type { CandidateTerm } from './candidate-term.js';
import { formatEnergy } from './energy-expression.js';
import type { RecordingSignals } from './recording-signals.js';

/**
 * The difference of two energies counts as conserved when, along every training recording, it varies by less
 * than this fraction of the size of its parts (our choice: parts that move by 1 and cancel to 1 % are no
 * accident of one term being small).
 */
export const CONSERVED_TOLERANCE = 1e-2;
/** Parts of the difference smaller than this fraction of its largest part are left out of its description. */
const PART_SHOWN = 1e-3;

export interface ConservedDifference {
  /** The difference (rival minus chosen) in the notation users type, coefficients to three digits. */
  text: string;
  /** rms of its variation within each recording over the rms size of its parts. */
  variation: number;
}

/**
 * When two energies fit the same recordings equally well, their difference D = E_rival - E_chosen keeps its
 * value along each recording: the recordings conserve D as well as the energy (a momentum of a free
 * coordinate, for example, and with it any function of it that the candidates can spell). Returns D when it
 * is conserved on every training recording within CONSERVED_TOLERANCE of the size of its parts, else null.
 */
export function conservedDifference(
  chosen: { terms: readonly CandidateTerm[]; coefficients: readonly number[] },
  rival: { terms: readonly CandidateTerm[]; coefficients: readonly number[] },
  signals: readonly RecordingSignals[],
): ConservedDifference | null {
  const parts = differenceParts(chosen, rival);
  const pieces = parts.map(({ term, coefficient }) => signals.map((s) => scaled(term.value(s.samples), coefficient)));
  const partSizes = pieces.map((perRecording) => Math.sqrt(variationAboutMean(perRecording)));
  const size = Math.sqrt(partSizes.reduce((sum, s) => sum + s * s, 0));
  if (!(size > 0)) return null;
  let within = 0;
  let count = 0;
  signals.forEach((s, r) => {
    const total = new Float64Array(s.length);
    for (const perRecording of pieces) for (let i = 0; i < s.length; i++) total[i] = total[i]! + perRecording[r]![i]!;
    within += variationAboutMean([total]) * s.length;
    count += s.length;
  });
  const variation = Math.sqrt(within / count) / size;
  if (!(variation < CONSERVED_TOLERANCE)) return null;
  const largest = Math.max(...partSizes);
  const shown = parts.filter((_, j) => partSizes[j]! >= PART_SHOWN * largest);
  return {
    text: formatEnergy(
      shown.map((p) => p.term),
      shown.map((p) => Number(p.coefficient.toPrecision(3))),
    ),
    variation,
  };
}

function differenceParts(
  chosen: { terms: readonly CandidateTerm[]; coefficients: readonly number[] },
  rival: { terms: readonly CandidateTerm[]; coefficients: readonly number[] },
): { term: CandidateTerm; coefficient: number }[] {
  const parts = new Map<string, { term: CandidateTerm; coefficient: number }>();
  const add = (terms: readonly CandidateTerm[], coefficients: readonly number[], sign: number) =>
    terms.forEach((term, j) => {
      const part = parts.get(term.text) ?? { term, coefficient: 0 };
      part.coefficient += sign * coefficients[j]!;
      parts.set(term.text, part);
    });
  add(rival.terms, rival.coefficients, 1);
  add(chosen.terms, chosen.coefficients, -1);
  return [...parts.values()].filter((p) => p.coefficient !== 0);
}

function scaled(values: Float64Array, factor: number): Float64Array {
  return values.map((v) => v * factor);
}

/** Mean square about the mean, over pieces joined end to end (one mean for all). */
function variationAboutMean(pieces: readonly Float64Array[]): number {
  let n = 0;
  let mean = 0;
  for (const piece of pieces) {
    n += piece.length;
    for (const v of piece) mean += v;
  }
  if (n === 0) return 0;
  mean /= n;
  let sum = 0;
  for (const piece of pieces) for (const v of piece) sum += (v - mean) ** 2;
  return sum / n;
}

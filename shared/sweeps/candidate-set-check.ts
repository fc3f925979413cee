import { assembleCandidateSet } from '../math/candidate-set.js';
import { prepareTerm, type CandidateTerm } from '../math/candidate-term.js';
import { DiscoveryInputError } from '../math/discovery-input-error.js';
import { TermError } from '../math/term-expression.js';
import { checkCoordinateNames, TermSymbols } from '../math/term-symbols.js';
import type { CandidateSetCheckInput, TermCheck, TermProblem, TermVerdict } from '../schemas/candidate-set.js';
import { sweepSettingsSchema } from '../schemas/sweep-description.js';

const constantProblem = 'it is a constant (its time derivative is identically zero), so no recording can identify its coefficient; remove it.';
const alreadyInEveryModel = 'It equals a known term or the reference term, which is in every model already.';

/** Parses and checks one term on its own; the verdict carries the refusal instead of throwing. */
function judgeTerm(typed: string, index: number, symbols: TermSymbols): { verdict: TermVerdict; term: CandidateTerm | null } {
  const verdict: TermVerdict = { index, typed, text: null, velocityDegree: null, error: null, excluded: null };
  try {
    const term = prepareTerm(typed, symbols);
    verdict.text = term.text;
    verdict.velocityDegree = term.velocityDegree;
    if (term.constant) {
      verdict.error = `Term "${typed}": ${constantProblem}`;
      return { verdict, term: null };
    }
    return { verdict, term };
  } catch (error) {
    if (error instanceof TermError || error instanceof DiscoveryInputError) {
      verdict.error = error.message;
      return { verdict, term: null };
    }
    throw error;
  }
}

/**
 * Checks a candidate set the way a sweep will read it (shared/math/candidate-set.ts): every term parsed on
 * its own so each refusal is reported at its index, then the set as a whole, which leaves out repeats and
 * multiples of other terms and refuses known terms that are multiples of each other.
 */
export function checkCandidateSet(input: CandidateSetCheckInput): TermCheck {
  const blank = (typed: string, index: number): TermVerdict => ({ index, typed, text: null, velocityDegree: null, error: null, excluded: null });
  try {
    checkCoordinateNames(input.coordinates);
  } catch (error) {
    if (!(error instanceof DiscoveryInputError)) throw error;
    return {
      valid: false,
      terms: input.terms.map(blank),
      known: input.known.map(blank),
      reference: input.reference ? blank(input.reference.term, 0) : null,
      problems: [{ path: 'coordinates', message: error.message }],
      candidateCount: 0,
      warnings: [],
    };
  }
  const symbols = new TermSymbols(input.coordinates);
  const terms = input.terms.map((typed, i) => judgeTerm(typed, i, symbols));
  const known = input.known.map((typed, i) => judgeTerm(typed, i, symbols));
  const reference = input.reference ? judgeTerm(input.reference.term, 0, symbols) : null;
  const problems: TermProblem[] = [
    ...terms.filter((t) => t.verdict.error).map((t) => ({ path: `terms.${t.verdict.index}`, message: t.verdict.error! })),
    ...known.filter((t) => t.verdict.error).map((t) => ({ path: `known.${t.verdict.index}`, message: t.verdict.error! })),
    ...(reference?.verdict.error ? [{ path: 'reference.term', message: reference.verdict.error }] : []),
  ];
  const result: TermCheck = {
    valid: false,
    terms: terms.map((t) => t.verdict),
    known: known.map((t) => t.verdict),
    reference: reference?.verdict ?? null,
    problems,
    candidateCount: 0,
    warnings: [],
  };
  if (problems.length > 0) return result;

  const settings = sweepSettingsSchema.parse({
    coordinates: input.coordinates,
    terms: input.terms,
    known: input.known,
    ...(input.reference ? { reference: input.reference } : {}),
    sizes: { max: 0 },
  });
  try {
    const set = assembleCandidateSet(settings, symbols);
    markExcluded(result.terms, set.candidates, set.excluded);
    result.candidateCount = set.candidates.length;
    result.warnings = set.warnings;
    result.valid = set.candidates.length > 0;
    if (!result.valid) result.problems.push({ path: 'terms', message: 'No candidate term is left once known and reference terms are taken out.' });
  } catch (error) {
    if (!(error instanceof DiscoveryInputError)) throw error;
    result.problems.push({ path: /^Known terms/.test(error.message) ? 'known' : /reference/.test(error.message) ? 'reference.term' : 'set', message: error.message });
  }
  return result;
}

/** Marks the verdicts of terms the set left out, with the reason; the kept ones appear in order among the candidates. */
function markExcluded(verdicts: TermVerdict[], kept: readonly CandidateTerm[], excluded: readonly { term: string; reason: string }[]): void {
  let next = 0;
  const reasons = [...excluded];
  for (const verdict of verdicts) {
    if (next < kept.length && kept[next]!.typed === verdict.typed) {
      next++;
      continue;
    }
    const at = reasons.findIndex((e) => e.term === verdict.text);
    verdict.excluded = at >= 0 ? `Left out: ${reasons.splice(at, 1)[0]!.reason}.` : alreadyInEveryModel;
  }
}

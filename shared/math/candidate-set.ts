import type { SweepSettings } from '../schemas/sweep-description.js';
import { prepareTerm, type CandidateTerm } from './candidate-term.js';
import { DiscoveryInputError } from './discovery-input-error.js';
import { parseExpression, TermError } from './term-expression.js';
import { formatTerm } from './term-format.js';
import { generateTerms } from './term-generator.js';
import type { TermSymbols } from './term-symbols.js';

export interface ExcludedTerm {
  term: string;
  reason: string;
}

/** The terms of a sweep by role: known (in every model), candidates (chosen from), the reference (fixed). */
export interface CandidateSet {
  known: CandidateTerm[];
  candidates: CandidateTerm[];
  reference: CandidateTerm | null;
  excluded: ExcludedTerm[];
  warnings: string[];
}

/**
 * Builds the candidate set from the settings: the typed terms, or the generated ones with the user's
 * additions and removals; every term parsed, checked and compiled. Terms are compared by canonical spelling:
 * a repeated candidate is left out (and listed as excluded), a candidate that is also known or the reference
 * is taken out of the candidates. A term that is a constant (every partial derivative zero) is refused: no
 * data can identify it.
 */
export function assembleCandidateSet(settings: SweepSettings, symbols: TermSymbols): CandidateSet {
  const excluded: ExcludedTerm[] = [];
  const warnings: string[] = [];
  const prepare = (text: string) => refuseConstant(prepareTerm(text, symbols));

  const known = uniqueByText(settings.known.map(prepare), (term, first) => {
    throw new DiscoveryInputError(`Known term "${term.typed}" is listed twice (as "${first.typed}").`);
  });
  const reference = settings.reference ? prepare(settings.reference.term) : null;
  if (reference && known.some((k) => k.text === reference.text)) {
    throw new DiscoveryInputError(`Term "${reference.typed}" cannot be both a known term and the reference term.`);
  }

  const fixed = new Set([...known.map((k) => k.text), ...(reference ? [reference.text] : [])]);
  const candidates = uniqueByText(candidateTexts(settings, symbols).map(prepare), (term, first) => {
    excluded.push({ term: term.text, reason: `the same term as "${first.typed}", already a candidate` });
  }).filter((term) => !fixed.has(term.text));

  const linear = [...known, ...candidates, ...(reference ? [reference] : [])].filter((t) => t.velocityDegree === 1);
  if (linear.length > 0) {
    warnings.push(
      `${linear.map((t) => t.text).join(', ')}: of velocity degree one, such terms drop out of the energy ` +
        `(H = sum dq dL/ddq - L), so their Lagrangian coefficients cannot be found from it.`,
    );
  }
  return { known, candidates, reference, excluded, warnings };
}

function candidateTexts(settings: SweepSettings, symbols: TermSymbols): string[] {
  if (settings.terms) return settings.terms;
  const options = settings.generate!;
  for (const angle of options.angles ?? []) {
    if (!symbols.coordinates.includes(angle)) {
      throw new DiscoveryInputError(`generate.angles names "${angle}", which is not a coordinate.`);
    }
  }
  const generated = generateTerms(symbols.coordinates, options).map((g) => g.text);
  const spelling = (text: string) => formatTerm(parseExpression(text, symbols).tree);
  const generatedSpellings = new Set(generated.map(spelling));
  const removed = new Set<string>();
  for (const text of options.remove) {
    const canonical = spelling(text);
    if (!generatedSpellings.has(canonical)) {
      throw new DiscoveryInputError(`generate.remove lists "${text}", which is not among the generated terms.`);
    }
    removed.add(canonical);
  }
  return [...generated.filter((text) => !removed.has(spelling(text))), ...options.add];
}

function refuseConstant(term: CandidateTerm): CandidateTerm {
  if (term.constant) {
    throw new TermError(
      term.typed,
      'it is a constant (its time derivative is identically zero), so no recording can identify its coefficient; remove it.',
    );
  }
  return term;
}

function uniqueByText(terms: CandidateTerm[], onRepeat: (term: CandidateTerm, first: CandidateTerm) => void): CandidateTerm[] {
  const firstByText = new Map<string, CandidateTerm>();
  const unique: CandidateTerm[] = [];
  for (const term of terms) {
    const first = firstByText.get(term.text);
    if (first) {
      onRepeat(term, first);
      continue;
    }
    firstByText.set(term.text, term);
    unique.push(term);
  }
  return unique;
}

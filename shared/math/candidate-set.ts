import type { SweepSettings } from '../schemas/sweep-description.js';
import { prepareTerm, type CandidateTerm } from './candidate-term.js';
import { DiscoveryInputError } from './discovery-input-error.js';
import { parseExpression, TermError } from './term-expression.js';
import { formatTerm } from './term-format.js';
import { termFingerprint } from './term-fingerprint.js';
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
 * additions and removals; every term parsed, checked and compiled. Terms are compared as functions
 * (term-fingerprint.ts): a candidate that is a known or the reference term is quietly taken out of the
 * candidates, one that merely equals a multiple of an earlier term is left out and listed as excluded. A
 * term that is a constant (every partial derivative zero) is refused: no data can identify it.
 */
export function assembleCandidateSet(settings: SweepSettings, symbols: TermSymbols): CandidateSet {
  const excluded: ExcludedTerm[] = [];
  const warnings: string[] = [];
  const prepare = (text: string) => refuseConstant(prepareTerm(text, symbols));
  const seen = new Map<string, { term: CandidateTerm; role: string }>();
  const twinOf = (term: CandidateTerm) => {
    const key = termFingerprint(term, symbols);
    return key === null ? undefined : seen.get(key);
  };
  const remember = (term: CandidateTerm, role: string) => {
    const key = termFingerprint(term, symbols);
    if (key !== null) seen.set(key, { term, role });
  };

  const known: CandidateTerm[] = [];
  for (const term of settings.known.map(prepare)) {
    const twin = twinOf(term);
    if (twin) throw new DiscoveryInputError(`Known terms "${twin.term.typed}" and "${term.typed}" are multiples of each other; keep one.`);
    remember(term, 'known term');
    known.push(term);
  }
  const reference = settings.reference ? prepare(settings.reference.term) : null;
  if (reference) {
    const twin = twinOf(reference);
    if (twin) {
      throw new DiscoveryInputError(`The reference term "${reference.typed}" is a multiple of the known term "${twin.term.typed}"; it cannot be both.`);
    }
    remember(reference, 'reference term');
  }

  const candidates: CandidateTerm[] = [];
  for (const term of candidateTexts(settings, symbols).map(prepare)) {
    const twin = twinOf(term);
    if (twin) {
      if (twin.role === 'candidate' || twin.term.text !== term.text) {
        const relation = twin.term.text === term.text ? 'the same term as' : 'equal to, or a constant multiple of,';
        excluded.push({ term: term.text, reason: `${relation} the ${twin.role} "${twin.term.text}"` });
      }
      continue;
    }
    remember(term, 'candidate');
    candidates.push(term);
  }

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

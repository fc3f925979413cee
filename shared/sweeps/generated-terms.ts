import { DiscoveryInputError } from '../math/discovery-input-error.js';
import { parseExpression } from '../math/term-expression.js';
import { formatTerm } from '../math/term-format.js';
import { generateTerms } from '../math/term-generator.js';
import { TermSymbols } from '../math/term-symbols.js';
import type { GeneratedTerms } from '../schemas/candidate-set.js';
import type { GeneratorSettings } from '../schemas/sweep-description.js';

/**
 * The generator's terms for the editor (shared/math/term-generator.ts), with the user's removals left out
 * (compared by canonical spelling) and additions appended. Throws DiscoveryInputError naming what is wrong.
 */
export function generatedTermList(coordinates: readonly string[], options: GeneratorSettings): GeneratedTerms {
  const symbols = new TermSymbols(coordinates);
  for (const angle of options.angles ?? []) {
    if (!symbols.coordinates.includes(angle)) throw new DiscoveryInputError(`generator.angles names "${angle}", which is not a coordinate.`);
  }
  const spelling = (text: string) => formatTerm(parseExpression(text, symbols).tree);
  const generated = generateTerms(coordinates, options);
  const spellings = new Set(generated.map((term) => spelling(term.text)));
  const removed = new Set<string>();
  for (const text of options.remove ?? []) {
    const canonical = spelling(text);
    if (!spellings.has(canonical)) throw new DiscoveryInputError(`generator.remove lists "${text}", which is not among the generated terms.`);
    removed.add(canonical);
  }
  return {
    terms: [
      ...generated.filter((term) => !removed.has(spelling(term.text))).map((term) => ({ text: term.text, family: term.family })),
      ...(options.add ?? []).map((text) => ({ text, family: 'added' as const })),
    ],
  };
}

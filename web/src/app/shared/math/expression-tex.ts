import { parseExpression } from '../../../../../shared/math/term-expression';
import { TermSymbols } from '../../../../../shared/math/term-symbols';
import { numberLatex, symbolLatexTable, termLatex } from '../../../../../shared/model/term-latex';

/*
 * Terms and energies in our notation (`dth^2*cos(th)`) as LaTeX, through the same parser and printer the
 * server uses, so a term reads the same in the editor, the leaderboard and the exports. Lazy chunk: it brings
 * the expression parser.
 */

const cache = new Map<string, string>();

/** LaTeX of an expression over the given coordinates; throws when the text is not a valid term. */
export function expressionTex(text: string, coordinates: readonly string[]): string {
  const key = `${coordinates.join(',')}|${text}`;
  const known = cache.get(key);
  if (known !== undefined) return known;
  const symbols = new TermSymbols(coordinates);
  const table = symbolLatexTable(coordinates, coordinates.map((c) => `u_${c}`));
  const tex = termLatex(parseExpression(text, symbols, { allowAccelerations: true }).tree, table);
  if (cache.size > 2000) cache.clear();
  cache.set(key, tex);
  return tex;
}

/** Why a typed energy term cannot be used, in the engine's own words, or null when it can. */
export function termProblem(text: string, coordinates: readonly string[]): string | null {
  try {
    parseExpression(text, new TermSymbols(coordinates));
    return null;
  } catch (error) {
    return error instanceof Error ? error.message : 'This term cannot be read.';
  }
}

/**
 * LaTeX of sum_j c_j theta_j with each coefficient rounded to `digits` significant digits, for lists where
 * the full-precision energy would not fit; a term that is itself a sum is put in parentheses.
 */
export function combinationTex(terms: readonly string[], coefficients: readonly number[], coordinates: readonly string[], digits = 4): string {
  const symbols = new TermSymbols(coordinates);
  const table = symbolLatexTable(coordinates, coordinates.map((c) => `u_${c}`));
  const parts = terms.map((term, i) => {
    const tree = parseExpression(term, symbols).tree;
    const body = termLatex(tree, table);
    const wrapped = tree.kind === 'add' || tree.kind === 'subtract' ? `\\left(${body}\\right)` : body;
    const coefficient = coefficients[i] ?? 0;
    const magnitude = numberLatex(Number(Math.abs(coefficient).toPrecision(digits)));
    return { negative: coefficient < 0, text: `${magnitude} \\, ${wrapped}` };
  });
  return parts.map((part, i) => (i === 0 ? (part.negative ? `-${part.text}` : part.text) : `${part.negative ? '-' : '+'} ${part.text}`)).join(' ') || '0';
}

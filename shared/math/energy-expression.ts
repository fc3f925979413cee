import { formatTerm, needsParenthesesAsFactor } from './term-format.js';
import type { TermTree } from './term-tree.js';

/**
 * Writes sum_j c_j theta_j in the notation users type, e.g. `0.032634*dth^2 - 1.524474*cos(th)`: terms in
 * the order given, each coefficient as String(c) (which round-trips every double, so nothing is lost), a
 * negative coefficient as a minus sign between terms, and terms that are sums in parentheses. Terms with a
 * null coefficient are left out; no terms at all give `0`.
 */
export function formatEnergy(terms: readonly { tree: TermTree }[], coefficients: readonly (number | null)[]): string {
  const parts: string[] = [];
  terms.forEach((term, j) => {
    const c = coefficients[j];
    if (c === null || c === undefined) return;
    const text = formatTerm(term.tree);
    const factor = needsParenthesesAsFactor(term.tree) ? `(${text})` : text;
    const negative = c < 0 || Object.is(c, -0);
    const magnitude = String(Math.abs(c));
    if (parts.length === 0) parts.push(`${negative ? '-' : ''}${magnitude}*${factor}`);
    else parts.push(`${negative ? '-' : '+'} ${magnitude}*${factor}`);
  });
  return parts.length === 0 ? '0' : parts.join(' ');
}

import { formatEnergy } from '../math/energy-expression.js';
import { parseExpression } from '../math/term-expression.js';
import { TermSymbols } from '../math/term-symbols.js';
import type { LeaderboardEntry } from '../schemas/sweep-leaderboard.js';
import type { ProblemMeta } from './problem-encoding.js';
import type { StoredEntry } from './stored-leaderboard.js';

/**
 * Leaderboard entries as people read them: the known terms and the chosen candidates with their
 * coefficients, the reference term last with its fixed coefficient, the energy written out, and the RMS
 * residual over the training rows.
 */
export function leaderboardEntries(meta: ProblemMeta, coordinates: readonly string[], stored: readonly StoredEntry[]): LeaderboardEntry[] {
  const symbols = new TermSymbols(coordinates);
  const trees = new Map<string, ReturnType<typeof parseExpression>['tree']>();
  const treeOf = (text: string) => {
    let tree = trees.get(text);
    if (!tree) {
      tree = parseExpression(text, symbols).tree;
      trees.set(text, tree);
    }
    return tree;
  };
  return stored.map((entry) => {
    const columns = [...Array.from({ length: meta.knownCount }, (_, i) => i), ...entry.members.map((j) => meta.knownCount + j)];
    const terms = columns.map((j) => meta.terms[j]!);
    const coefficients = [...entry.coefficients];
    if (meta.reference) {
      terms.push(meta.reference.term);
      coefficients.push(meta.reference.coefficient);
    }
    return {
      size: entry.size,
      terms,
      coefficients,
      energy: formatEnergy(terms.map((text) => ({ tree: treeOf(text) })), coefficients),
      rss: entry.rss,
      rmse: Math.sqrt(entry.rss / Math.max(1, meta.rowCount)),
    };
  });
}

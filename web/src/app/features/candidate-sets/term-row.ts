import type { CandidateSetCheckInput, TermCheck, TermVerdict } from '../../../../../shared/schemas/candidate-set';

export type TermRole = 'candidate' | 'known' | 'reference';
export type TermFamily = 'coordinate-power' | 'trigonometric' | 'angle-difference' | 'kinetic' | 'added';

/** One term in the editor, whatever its role; the set sent to the server is built from the rows. */
export interface TermRow {
  /** Stable identity for the list while terms move between roles. */
  id: number;
  text: string;
  role: TermRole;
  family: TermFamily | null;
}

export const familyLabels: Record<TermFamily, string> = {
  'coordinate-power': 'power',
  trigonometric: 'trigonometric',
  'angle-difference': 'angle difference',
  kinetic: 'kinetic',
  added: 'added',
};

/** The rows as the server reads a candidate set: candidates, known terms, and the reference term. */
export function setFromRows(
  rows: readonly TermRow[],
  base: { name: string; coordinates: string[]; referenceCoefficient: number },
): CandidateSetCheckInput {
  const reference = rows.find((row) => row.role === 'reference');
  return {
    name: base.name,
    coordinates: base.coordinates,
    terms: rows.filter((row) => row.role === 'candidate').map((row) => row.text),
    known: rows.filter((row) => row.role === 'known').map((row) => row.text),
    reference: reference ? { term: reference.text, coefficient: base.referenceCoefficient } : null,
    generator: null,
  };
}

/** The server's verdict on each row (by role and position within the role), keyed by row id. */
export function verdictsByRow(rows: readonly TermRow[], check: TermCheck): Map<number, TermVerdict> {
  const byRow = new Map<number, TermVerdict>();
  let candidate = 0;
  let known = 0;
  for (const row of rows) {
    const verdict =
      row.role === 'candidate' ? check.terms[candidate++] : row.role === 'known' ? check.known[known++] : (check.reference ?? undefined);
    if (verdict && verdict.typed === row.text) byRow.set(row.id, verdict);
  }
  return byRow;
}

/** Server field keys (`terms.3`, `known.0`, `reference.term`) turned into row ids, for messages next to terms. */
export function rowForField(rows: readonly TermRow[], key: string): number | null {
  if (key === 'reference.term' || key === 'reference.coefficient' || key === 'reference') {
    return rows.find((row) => row.role === 'reference')?.id ?? null;
  }
  const match = /^(terms|known)\.(\d+)$/.exec(key);
  if (!match) return null;
  const role: TermRole = match[1] === 'terms' ? 'candidate' : 'known';
  return rows.filter((row) => row.role === role)[Number(match[2])]?.id ?? null;
}

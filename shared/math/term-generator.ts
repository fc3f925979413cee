/** Options of the candidate generator; every field has a default (see `generateTerms`). */
export interface GeneratorOptions {
  /** Highest total degree of the coordinate monomials (family P). Default 2; 0 turns the family off. */
  polynomialDegree?: number;
  /** Coordinates that are angles and get the trigonometric families T, D and the trigonometric factors. Default: all. */
  angles?: string[];
  /** Whether to generate sin and cos of the angles (family T and the factors sin, cos, sin^2). Default true. */
  trigonometric?: boolean;
  /** Whether to generate sin and cos of differences of two angles (family D and those factors). Default true. */
  differences?: boolean;
  /** Highest degree of the velocity monomials (family V); they start at degree 2. Default 2. */
  velocityDegree?: number;
  /** Whether velocity monomials are also multiplied by the factors F (see below). Default true. */
  kineticFactors?: boolean;
  /** Highest degree of coordinate monomials used as kinetic factors (r^2*dth^2). Default 0 (none). */
  kineticPolynomialDegree?: number;
}

export type TermFamily = 'coordinate-power' | 'trigonometric' | 'angle-difference' | 'kinetic';

export interface GeneratedTerm {
  text: string;
  family: TermFamily;
}

/**
 * Generates a documented candidate set for coordinates q_1..q_n, of which a are angles. In this order:
 *
 * - P, coordinate powers: every monomial of the coordinates of total degree 1..polynomialDegree
 *   (`x`, `x^2`, `x*y`): C(n + d, d) - 1 terms.
 * - T, trigonometric: `sin(a)` and `cos(a)` for every angle a: 2a terms.
 * - D, angle differences: `sin(a - b)` and `cos(a - b)` for every pair of angles, in the order given:
 *   2 C(a, 2) terms.
 * - K, kinetic: every velocity monomial of degree 2..velocityDegree (`dx^2`, `dx*dy`; V = sum over j of
 *   C(n + j - 1, j) of them), each multiplied by every factor of F: 1; `sin(a)`, `cos(a)`, `sin(a)^2` per
 *   angle; `sin(a - b)`, `cos(a - b)` per pair of angles; the coordinate monomials of degree
 *   1..kineticPolynomialDegree. |F| = 1 + 3a + 2 C(a, 2) + C(n + k, k) - 1 with the trigonometric parts
 *   present only when switched on, and |F| = 1 without kinetic factors.
 *
 * Total: P + T + D + V |F|. With the defaults (degree 2 everywhere, all coordinates angles, no kinetic
 * monomial factors): 8 terms for one coordinate, 38 for two, 117 for three.
 *
 * Velocity monomials of degree 1 are never generated: they are invisible in the energy (method.md section 4).
 * `cos(a)^2` is left out because it equals 1 - sin(a)^2, which would only add rank-deficient pairs.
 */
export function generateTerms(coordinates: readonly string[], options: GeneratorOptions = {}): GeneratedTerm[] {
  const polynomialDegree = options.polynomialDegree ?? 2;
  const angles = options.angles ?? [...coordinates];
  const trigonometric = options.trigonometric ?? true;
  const differences = options.differences ?? true;
  const velocityDegree = options.velocityDegree ?? 2;
  const kineticFactors = options.kineticFactors ?? true;
  const kineticPolynomialDegree = options.kineticPolynomialDegree ?? 0;

  const terms: GeneratedTerm[] = [];
  const add = (family: TermFamily) => (text: string) => terms.push({ text, family });

  monomials(coordinates, 1, polynomialDegree).forEach(add('coordinate-power'));
  const single = trigonometric ? angles.flatMap((a) => [`sin(${a})`, `cos(${a})`]) : [];
  single.forEach(add('trigonometric'));
  const pairs = differences ? anglePairs(angles).flatMap(([a, b]) => [`sin(${a} - ${b})`, `cos(${a} - ${b})`]) : [];
  pairs.forEach(add('angle-difference'));

  const factors = kineticFactors
    ? [
        ...(trigonometric ? angles.flatMap((a) => [`sin(${a})`, `cos(${a})`, `sin(${a})^2`]) : []),
        ...pairs,
        ...monomials(coordinates, 1, kineticPolynomialDegree),
      ]
    : [];
  const velocities = coordinates.map((c) => `d${c}`);
  for (const velocity of monomials(velocities, 2, velocityDegree)) {
    add('kinetic')(velocity);
    for (const factor of factors) add('kinetic')(`${velocity}*${factor}`);
  }
  return terms;
}

/** Monomials of total degree from..to in the given symbols, by degree, then in the symbols' order. */
function monomials(symbols: readonly string[], from: number, to: number): string[] {
  const result: string[] = [];
  for (let degree = Math.max(from, 1); degree <= to; degree++) {
    for (const powers of exponentVectors(symbols.length, degree)) result.push(monomialText(symbols, powers));
  }
  return result;
}

/** All vectors of `count` non-negative integers summing to `degree`, first entries largest first. */
function exponentVectors(count: number, degree: number): number[][] {
  if (count === 1) return [[degree]];
  const vectors: number[][] = [];
  for (let first = degree; first >= 0; first--) {
    for (const rest of exponentVectors(count - 1, degree - first)) vectors.push([first, ...rest]);
  }
  return vectors;
}

function monomialText(symbols: readonly string[], powers: number[]): string {
  return powers
    .map((power, i) => (power === 0 ? '' : power === 1 ? symbols[i]! : `${symbols[i]}^${power}`))
    .filter((part) => part !== '')
    .join('*');
}

function anglePairs(angles: readonly string[]): [string, string][] {
  const pairs: [string, string][] = [];
  for (let i = 0; i < angles.length; i++) {
    for (let j = i + 1; j < angles.length; j++) pairs.push([angles[i]!, angles[j]!]);
  }
  return pairs;
}

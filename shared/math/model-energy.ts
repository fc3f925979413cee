import { compilePoint, type PointFunction } from './point-compiler.js';
import { parseExpression } from './term-expression.js';
import { TermSymbols } from './term-symbols.js';

/** A model's energy at one state: its value and the size of its parts, sum_j |c_j theta_j|. */
export interface EnergyAtState {
  value: number;
  scale: number;
}

/** E(q, dq) = sum_j c_j theta_j compiled for single states; `into` is reused, nothing is allocated per call. */
export type ModelEnergy = (q: ArrayLike<number>, dq: ArrayLike<number>, into: EnergyAtState) => EnergyAtState;

/** Compiles an energy given as terms and coefficients; throws TermError naming a refused term. */
export function compileModelEnergy(
  coordinates: readonly string[],
  terms: readonly string[],
  coefficients: readonly number[],
): ModelEnergy {
  const symbols = new TermSymbols(coordinates);
  const n = coordinates.length;
  const slots = new Map<string, number>();
  coordinates.forEach((c, i) => slots.set(c, i));
  symbols.velocities.forEach((v, i) => slots.set(v, n + i));
  const parts: { term: PointFunction; coefficient: number }[] = terms.map((text, j) => ({
    term: compilePoint(parseExpression(text, symbols).tree, slots),
    coefficient: coefficients[j]!,
  }));
  const values = new Float64Array(2 * n);
  return (q, dq, into) => {
    for (let i = 0; i < n; i++) {
      values[i] = q[i]!;
      values[n + i] = dq[i]!;
    }
    let value = 0;
    let scale = 0;
    for (const part of parts) {
      const contribution = part.coefficient * part.term(values);
      value += contribution;
      scale += Math.abs(contribution);
    }
    into.value = value;
    into.scale = scale;
    return into;
  };
}

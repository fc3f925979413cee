import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { CandidateTerm } from './candidate-term.js';
import { energyOnSamples } from './energy-on-samples.js';
import { concatenate, rootMeanSquare } from './form-rows.js';
import { NEGLIGIBLE_ENERGY_CHANGE } from './negligible-terms.js';
import type { RecordingSignals } from './recording-signals.js';
import type { SampleColumns } from './term-compiler.js';

/** Below this share of the training samples a degenerate kinetic part is left unreported (a singular pose). */
const REPORTED_SHARE = 0.01;

export interface KineticDegeneracy {
  /** Share of the training samples where the kinetic part is degenerate. */
  share: number;
  /** Velocities along which it is, largest component 1, in the order of the velocity names given. */
  direction: number[];
  /** True when it is degenerate along every direction: the energy has next to no kinetic part at all. */
  everyDirection: boolean;
}

/**
 * Checks that an energy's kinetic part can drive every coordinate. With s_i the rms of velocity i on the
 * training samples, S_ik = s_i s_k d^2E / d dq_i d dq_k (second differences of the energy with steps s_i,
 * exact for terms quadratic in the velocities) is the mass matrix of its Lagrangian in energy units; the
 * kinetic energy of a velocity change of the recorded size along a unit direction v is v^T S v / 2. Where
 * the smallest such energy is below NEGLIGIBLE_ENERGY_CHANGE of the energy's variation, or negative, the
 * Lagrangian cannot say how the mechanism moves along v (method.md section 5 needs M positive definite).
 * Returns the share of degenerate samples and the direction (averaged over them), or null below 1 %.
 */
export function kineticDegeneracy(
  terms: readonly CandidateTerm[],
  coefficients: readonly number[],
  signals: readonly RecordingSignals[],
  velocities: readonly string[],
): KineticDegeneracy | null {
  const energy = energyOnSamples(terms, coefficients, signals);
  const variation = rootMeanSquare(aboutMean(energy));
  const steps = velocities.map((name) => rootMeanSquare(concatenate(signals.map((s) => s.samples.column(name)))));
  if (!(variation > 0)) return null;
  const floor = 2 * NEGLIGIBLE_ENERGY_CHANGE * variation;
  const n = velocities.length;
  const sum = new Matrix(n, n);
  let degenerate = 0;
  let total = 0;
  for (const recording of signals) {
    const matrices = scaledMassMatrices(terms, coefficients, recording, velocities, steps);
    for (let k = 0; k < recording.length; k++) {
      total++;
      const s = matrices(k);
      if (positiveDefiniteAbove(s, floor)) continue;
      degenerate++;
      sum.add(new Matrix(s));
    }
  }
  const share = total > 0 ? degenerate / total : 0;
  if (share < REPORTED_SHARE) return null;
  const decomposition = new EigenvalueDecomposition(sum, { assumeSymmetric: true });
  const values = decomposition.realEigenvalues;
  const everyDirection = Math.max(...values) < floor * degenerate;
  const smallest = values.indexOf(Math.min(...values));
  const direction = decomposition.eigenvectorMatrix.getColumn(smallest).map((v, i) => v * steps[i]!);
  const largest = direction.reduce((a, b) => (Math.abs(b) > Math.abs(a) ? b : a), 0);
  return { share, direction: largest === 0 ? direction : direction.map((v) => v / largest), everyDirection };
}

/** S at each sample of one recording, from energies at velocities shifted by +-s_i (and +-s_k). */
function scaledMassMatrices(
  terms: readonly CandidateTerm[],
  coefficients: readonly number[],
  recording: RecordingSignals,
  velocities: readonly string[],
  steps: readonly number[],
): (k: number) => number[][] {
  const n = velocities.length;
  const energyAt = (shifts: Record<string, number>) =>
    energyOnSamples(terms, coefficients, [{ ...recording, samples: shifted(recording.samples, shifts) }]);
  const base = energyAt({});
  const entries: Float64Array[][] = Array.from({ length: n }, () => new Array<Float64Array>(n));
  for (let i = 0; i < n; i++) {
    const vi = velocities[i]!;
    const plus = energyAt({ [vi]: steps[i]! });
    const minus = energyAt({ [vi]: -steps[i]! });
    entries[i]![i] = plus.map((p, k) => p - 2 * base[k]! + minus[k]!);
    for (let j = i + 1; j < n; j++) {
      const vj = velocities[j]!;
      const at = (a: number, b: number) => energyAt({ [vi]: a * steps[i]!, [vj]: b * steps[j]! });
      const pp = at(1, 1);
      const pm = at(1, -1);
      const mp = at(-1, 1);
      const mm = at(-1, -1);
      entries[i]![j] = pp.map((v, k) => (v - pm[k]! - mp[k]! + mm[k]!) / 4);
      entries[j]![i] = entries[i]![j]!;
    }
  }
  return (k) => entries.map((row) => row.map((column) => column[k]!));
}

function shifted(samples: SampleColumns, shifts: Record<string, number>): SampleColumns {
  const columns = new Map(Object.entries(shifts).map(([name, shift]) => [name, samples.column(name).map((v) => v + shift)]));
  return { length: samples.length, column: (name) => columns.get(name) ?? samples.column(name) };
}

/** Whether S - floor I has a Cholesky factor (all pivots positive): every eigenvalue of S above floor. */
function positiveDefiniteAbove(s: number[][], floor: number): boolean {
  const n = s.length;
  const l = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let value = s[i]![j]! - (i === j ? floor : 0);
      for (let k = 0; k < j; k++) value -= l[i]![k]! * l[j]![k]!;
      if (i === j) {
        if (!(value > 0)) return false;
        l[i]![i] = Math.sqrt(value);
      } else {
        l[i]![j] = value / l[j]![j]!;
      }
    }
  }
  return true;
}

function aboutMean(values: Float64Array): Float64Array {
  let mean = 0;
  for (const v of values) mean += v / values.length;
  return values.map((v) => v - mean);
}

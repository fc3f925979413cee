import type { DiscoveredModel } from '../schemas/discovery-result.js';
import type { CandidateTerm } from './candidate-term.js';
import { formatEnergy } from './energy-expression.js';
import { lagrangianFromEnergy } from './legendre.js';
import { scoreFit } from './model-scores.js';
import type { RecordingSignals } from './recording-signals.js';
import { refitColumns, residualSumOfSquares } from './refit.js';
import type { RegressionSystem } from './regression-system.js';
import type { RankedSubset } from './sweep-problem.js';

/** Which candidates a model uses: a leaderboard subset, or one built by a later rule (negligible-terms.ts). */
export type SubsetChoice = Pick<RankedSubset, 'size' | 'members'>;

/** A leaderboard entry worked out, with the column indices it uses for later comparisons. */
export interface WorkedModel extends DiscoveredModel {
  /** Indices into the training system's terms of the fitted columns (known first). */
  columns: number[];
}

export interface ModelContext {
  training: RegressionSystem;
  validation: RegressionSystem | null;
  reference: { term: CandidateTerm; coefficient: number } | null;
  trainingSignals: readonly RecordingSignals[];
}

/** Column indices of a subset: the known columns, then the chosen candidates. */
export function subsetColumns(subset: SubsetChoice, knownCount: number): number[] {
  return [...Array.from({ length: knownCount }, (_, i) => i), ...subset.members.map((m) => knownCount + m)];
}

/**
 * Re-fits one subset on the original columns and works it out: coefficients, residual scores,
 * validation error (the same form's residual on the validation recordings), energy and Lagrangian.
 */
export function workOutModel(subset: SubsetChoice, context: ModelContext): WorkedModel {
  const { training, validation, reference } = context;
  const columns = subsetColumns(subset, training.knownCount);
  const fit = refitColumns(
    columns.map((j) => training.columns[j]!),
    training.rhs,
  );
  const scores = scoreFit(fit.rss, training.rhs, columns.length);
  const validationRmse = validation
    ? Math.sqrt(
        residualSumOfSquares(
          columns.map((j) => validation.columns[j]!),
          fit.coefficients,
          validation.rhs,
        ) / validation.rowCount,
      )
    : null;
  const terms = [...columns.map((j) => training.terms[j]!), ...(reference ? [reference.term] : [])];
  const coefficients = [...fit.coefficients, ...(reference ? [reference.coefficient] : [])];
  const legendre = lagrangianFromEnergy(terms, coefficients, context.trainingSignals);
  return {
    size: subset.size,
    columns,
    terms: terms.map((t) => t.text),
    coefficients,
    energy: formatEnergy(terms, coefficients),
    lagrangian: formatEnergy(terms, legendre.coefficients),
    lagrangianCoefficients: legendre.coefficients,
    notIdentifiable: legendre.notIdentifiable,
    legendreResidual: legendre.relativeResidual,
    rss: fit.rss,
    trainRmse: scores.rmse,
    validationRmse,
    r2: scores.r2,
    bic: scores.bic,
    conditionNumber: fit.conditionNumber,
  };
}

import type { SweepSettings } from '../schemas/sweep-description.js';
import { balanceFormRows } from './balance-form.js';
import type { CandidateTerm } from './candidate-term.js';
import type { CandidateSet, ExcludedTerm } from './candidate-set.js';
import { derivativeFormRows } from './derivative-form.js';
import { DiscoveryInputError } from './discovery-input-error.js';
import { rootMeanSquare, type FormRows } from './form-rows.js';
import type { RecordingSignals } from './recording-signals.js';

/**
 * A column counts as zero on the data when the change of its term over the data is below this fraction of
 * the term's own size: rounding in a constant's derivative (sin^2 + cos^2) or a coordinate that never moves.
 */
export const ZERO_COLUMN_TOLERANCE = 1e-9;

/**
 * The least-squares problem A c = y of one regression form over some recordings. Columns of A are ordered
 * as `terms`: the known terms, then the candidates; the reference term (if any) is not a column, its fixed
 * contribution has moved to the right side: y = P - c_ref a_ref.
 */
export interface RegressionSystem {
  terms: CandidateTerm[];
  knownCount: number;
  columns: Float64Array[];
  rhs: Float64Array;
  rowCount: number;
}

export type FormSettings = Pick<SweepSettings, 'form' | 'balance' | 'reference'>;

/**
 * The form's rows for any list of terms. Refuses a term that is not finite on some recording (`1/x` where x
 * passes through 0), naming the term, the recording and the time.
 */
export function formRows(settings: FormSettings, signals: readonly RecordingSignals[], terms: readonly CandidateTerm[]): FormRows {
  for (const s of signals) for (const term of terms) checkFinite(term, s, settings.form === 'derivative');
  return settings.form === 'derivative' ? derivativeFormRows(signals, terms) : balanceFormRows(signals, terms, settings.balance);
}

function checkFinite(term: CandidateTerm, signals: RecordingSignals, rates: boolean): void {
  for (const [what, values] of [
    ['its value', term.value(signals.samples)],
    ...(rates ? [['its time derivative', term.timeDerivative(signals.samples)] as const] : []),
  ] as const) {
    const k = values.findIndex((v) => !Number.isFinite(v));
    if (k >= 0) {
      throw new DiscoveryInputError(
        `Term "${term.typed}": ${what} is not a finite number in ${signals.name} at time ${signals.time[k]}; ` +
          'remove the term or the samples where it is undefined.',
      );
    }
  }
}

/**
 * Builds the training system and screens its columns: a candidate whose column is zero on the data is left
 * out and reported in `excluded`; a known or reference term whose column is zero is an input error, because
 * the user asked for it to be in every model.
 */
export function buildTrainingSystem(
  settings: FormSettings,
  signals: readonly RecordingSignals[],
  set: CandidateSet,
  excluded: ExcludedTerm[],
): RegressionSystem {
  const reference = set.reference;
  const all = [...set.known, ...set.candidates, ...(reference ? [reference] : [])];
  const rows = formRows(settings, signals, all);
  const zero = rows.columns.map(
    (column, j) => rootMeanSquare(column) * rows.changeScale <= ZERO_COLUMN_TOLERANCE * rows.valueScales[j]!,
  );
  const reason = (j: number) =>
    rows.valueScales[j] === 0 ? 'it is zero on the training data' : 'it does not change on the training data (its time derivative is zero there)';
  all.forEach((term, j) => {
    if (!zero[j]) return;
    const role = j < set.known.length ? 'Known term' : term === reference ? 'Reference term' : null;
    if (role) throw new DiscoveryInputError(`${role} "${term.typed}" cannot be identified: ${reason(j)}.`);
    excluded.push({ term: term.text, reason: reason(j) });
  });
  const keep = all.map((term, j) => !zero[j] && term !== reference);
  const terms = all.filter((_, j) => keep[j]);
  const columns = rows.columns.filter((_, j) => keep[j]);
  const referenceColumn = reference ? rows.columns[all.length - 1]! : null;
  return {
    terms,
    knownCount: set.known.length,
    columns,
    rhs: rightSide(rows, referenceColumn, settings.reference?.coefficient ?? 0),
    rowCount: rows.rowCount,
  };
}

/** The system of other recordings (validation) over the same terms, in the same order. */
export function buildSystemFor(
  settings: FormSettings,
  signals: readonly RecordingSignals[],
  training: RegressionSystem,
  reference: CandidateTerm | null,
): RegressionSystem {
  return { ...training, ...columnsAndRightSide(settings, signals, training.terms, reference) };
}

/** Columns of the given terms and the right side (with the reference term moved to it) over some signals. */
export function columnsAndRightSide(
  settings: FormSettings,
  signals: readonly RecordingSignals[],
  terms: readonly CandidateTerm[],
  reference: CandidateTerm | null,
): Pick<RegressionSystem, 'columns' | 'rhs' | 'rowCount'> {
  const rows = formRows(settings, signals, [...terms, ...(reference ? [reference] : [])]);
  const referenceColumn = reference ? rows.columns[rows.columns.length - 1]! : null;
  return {
    columns: rows.columns.slice(0, terms.length),
    rhs: rightSide(rows, referenceColumn, settings.reference?.coefficient ?? 0),
    rowCount: rows.rowCount,
  };
}

function rightSide(rows: FormRows, referenceColumn: Float64Array | null, referenceCoefficient: number): Float64Array {
  const y = rows.power ? Float64Array.from(rows.power) : new Float64Array(rows.rowCount);
  if (referenceColumn) for (let i = 0; i < y.length; i++) y[i] = y[i]! - referenceCoefficient * referenceColumn[i]!;
  return y;
}

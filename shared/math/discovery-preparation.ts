import type { SweepSettings } from '../schemas/sweep-description.js';
import { assembleCandidateSet, type CandidateSet, type ExcludedTerm } from './candidate-set.js';
import { countSubsets } from './combinations.js';
import { DiscoveryInputError } from './discovery-input-error.js';
import { buildGramProblem } from './gram-problem.js';
import type { Recording } from './recording.js';
import { recordingSignals, type RecordingSignals } from './recording-signals.js';
import { refitColumns } from './refit.js';
import { buildSystemFor, buildTrainingSystem, type RegressionSystem } from './regression-system.js';
import type { GramProblem } from './sweep-problem.js';
import { TermSymbols } from './term-symbols.js';

/** Known columns whose scaled condition number exceeds this are refused as linearly dependent. */
const KNOWN_CONDITION_LIMIT = 1e8;

/** Everything a sweep needs, and everything its finish needs, built once from the settings and recordings. */
export interface PreparedDiscovery {
  symbols: TermSymbols;
  set: CandidateSet;
  train: Recording[];
  validate: Recording[];
  needAccelerations: boolean;
  trainingSignals: RecordingSignals[];
  training: RegressionSystem;
  validation: RegressionSystem | null;
  /** m': candidates left after screening. */
  candidateCount: number;
  /** The size range actually swept. */
  sizes: { min: number; max: number };
  /** Subsets in that range. */
  total: number;
  problem: GramProblem;
  /** Norms of the training columns, by which `problem` is scaled (buildGramProblem). */
  scales: Float64Array;
  excluded: ExcludedTerm[];
  warnings: string[];
}

/**
 * The preparation step (design: "prepare"): candidate set, signals per recording, the training and
 * validation systems of the chosen form, column screening, the size range and the scaled Gram problem.
 * Throws DiscoveryInputError for anything wrong with the settings or the recordings.
 */
export function prepareDiscovery(settings: SweepSettings, recordings: readonly Recording[]): PreparedDiscovery {
  const symbols = new TermSymbols(settings.coordinates);
  const set = assembleCandidateSet(settings, symbols);
  const warnings = [...set.warnings];
  const excluded: ExcludedTerm[] = [...set.excluded];

  const train = recordings.filter((r) => r.role === 'train');
  const validate = recordings.filter((r) => r.role === 'validate');
  if (train.length === 0) throw new DiscoveryInputError('At least one recording must be used for training.');
  if (!train.some(carriesForces) && !set.reference) {
    throw new DiscoveryInputError(
      'The training recordings carry no forces, so the scale of the energy is free: name a reference term with a ' +
        'fixed coefficient ("reference": {"term": ..., "coefficient": ...}), or map the force columns.',
    );
  }

  const allTerms = [...set.known, ...set.candidates, ...(set.reference ? [set.reference] : [])];
  const needAccelerations = settings.form === 'derivative' && allTerms.some((t) => t.needsAcceleration);
  const signalsOf = (list: Recording[]) => list.map((r) => recordingSignals(r, symbols, settings.derivatives, needAccelerations));
  const trainingSignals = signalsOf(train);
  const validationSignals = signalsOf(validate);

  const training = buildTrainingSystem(settings, trainingSignals, set, excluded);
  const candidateCount = training.terms.length - training.knownCount;
  const sizes = sizeRange(settings, candidateCount, training.knownCount, training.rowCount, warnings);
  checkKnownColumns(training);
  const validation = validationSignals.length > 0 ? buildSystemFor(settings, validationSignals, training, set.reference) : null;
  const { problem, scales } = buildGramProblem(training.columns, training.rhs, training.knownCount);
  return {
    symbols,
    set,
    train,
    validate,
    needAccelerations,
    trainingSignals,
    training,
    validation,
    candidateCount,
    sizes,
    total: countSubsets(candidateCount, sizes.min, sizes.max),
    problem,
    scales,
    excluded,
    warnings,
  };
}

function carriesForces(recording: Recording): boolean {
  return (recording.forces ?? []).some((force) => force !== null && force.some((u) => u !== 0));
}

/** The size range actually swept, refusing ranges no candidate set or row count can serve. */
function sizeRange(
  settings: SweepSettings,
  candidateCount: number,
  knownCount: number,
  rowCount: number,
  warnings: string[],
): { min: number; max: number } {
  const { min, max } = settings.sizes;
  if (min > candidateCount) {
    throw new DiscoveryInputError(`sizes.min is ${min}, but only ${candidateCount} candidate terms are left to choose from.`);
  }
  if (max > candidateCount) {
    warnings.push(`sizes.max is ${max}, but only ${candidateCount} candidate terms are left: the sweep stops at ${candidateCount}.`);
  }
  const largest = Math.min(max, candidateCount);
  if (rowCount <= knownCount + largest) {
    throw new DiscoveryInputError(
      `The training data give ${rowCount} regression rows, too few for models of up to ${knownCount + largest} terms: ` +
        'use longer recordings, more recordings, or a smaller balance stride.',
    );
  }
  return { min, max: largest };
}

/** The kernel needs independent known columns; say so plainly instead of letting it fail. */
function checkKnownColumns(training: RegressionSystem): void {
  const count = training.knownCount;
  if (count < 2) return;
  const fit = refitColumns(training.columns.slice(0, count), training.rhs);
  if (!(fit.conditionNumber < KNOWN_CONDITION_LIMIT)) {
    throw new DiscoveryInputError(
      `The known terms ${training.terms.slice(0, count).map((t) => t.text).join(', ')} are linearly dependent on the ` +
        `training data (condition number ${fit.conditionNumber.toPrecision(3)}); remove one of them.`,
    );
  }
}

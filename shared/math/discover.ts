import type { DiscoveryResult, SizeFrontEntry } from '../schemas/discovery-result.js';
import type { SweepSettings } from '../schemas/sweep-description.js';
import { safetyCaution } from '../model/safety-caution.js';
import { assembleCandidateSet, type ExcludedTerm } from './candidate-set.js';
import { splitRankSpace, countSubsets } from './combinations.js';
import { DiscoveryInputError } from './discovery-input-error.js';
import { buildGramProblem } from './gram-problem.js';
import { workOutModel, type ModelContext, type WorkedModel } from './leaderboard-models.js';
import {
  indistinguishableWarning,
  rankingTolerance,
  rankModels,
  scoreOf,
  type RankingCriterion,
  type RankingRule,
} from './model-choice.js';
import type { Recording } from './recording.js';
import { describeEstimator, recordingSignals } from './recording-signals.js';
import { NOISE_FLOOR_FACTOR, noiseFloorRmse } from './noise-floor.js';
import { refitColumns } from './refit.js';
import { createNormalRandom, createSeededRandom } from './seeded-random.js';
import { buildSystemFor, buildTrainingSystem } from './regression-system.js';
import { evaluateSlices } from './sweep-kernel.js';
import type { RankedSubset, SweepOutcome } from './sweep-problem.js';
import { TermSymbols } from './term-symbols.js';

export interface DiscoveryProgress {
  stage: 'signals' | 'sweep' | 'refit';
  evaluated: number;
  rejected: number;
  /** Subsets in the whole sweep. */
  total: number;
}

export interface DiscoveryOptions {
  onProgress?: (progress: DiscoveryProgress) => void;
  /** Checked during the sweep; returning true ends it early with the models found so far. */
  shouldStop?: () => boolean;
}

/** Known columns whose scaled condition number exceeds this are refused as linearly dependent. */
const KNOWN_CONDITION_LIMIT = 1e8;
const SUBSETS_PER_SLICE = 1_000_000;
/** Fixed seed of the noise draws, so a discovery gives the same result every time it runs. */
const NOISE_SEED = 20261202;

/**
 * The whole discovery on recordings already read: candidate set, signals per recording, the chosen
 * regression form, the exhaustive sweep over subsets (sweep-kernel.ts), the re-fit of the leaderboard, model
 * choice across sizes, and the Lagrangian of every model. Pure: no I/O; throws DiscoveryInputError for
 * anything wrong with the settings or the recordings.
 */
export function discover(settings: SweepSettings, recordings: readonly Recording[], options: DiscoveryOptions = {}): DiscoveryResult {
  const startedAt = performance.now();
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
  options.onProgress?.({ stage: 'signals', evaluated: 0, rejected: 0, total: 0 });
  const signalsOf = (list: Recording[]) => list.map((r) => recordingSignals(r, symbols, settings.derivatives, needAccelerations));
  const trainingSignals = signalsOf(train);
  const validationSignals = signalsOf(validate);

  const training = buildTrainingSystem(settings, trainingSignals, set, excluded);
  const candidateCount = training.terms.length - training.knownCount;
  const sizes = sizeRange(settings, candidateCount, training.knownCount, training.rowCount, warnings);
  checkKnownColumns(training.columns.slice(0, training.knownCount), training.rhs, training.terms.map((t) => t.text));
  const validation = validationSignals.length > 0 ? buildSystemFor(settings, validationSignals, training, set.reference) : null;

  const total = countSubsets(candidateCount, sizes.min, sizes.max);
  const { problem } = buildGramProblem(training.columns, training.rhs, training.knownCount);
  const outcome = evaluateSlices(problem, splitRankSpace(candidateCount, sizes.min, sizes.max, SUBSETS_PER_SLICE), {
    top: settings.top,
    onProgress: (p) => options.onProgress?.({ stage: 'sweep', ...p, total }),
    ...(options.shouldStop ? { shouldStop: options.shouldStop } : {}),
  });
  if (outcome.stopped) warnings.push('The sweep was stopped before every subset was evaluated.');
  options.onProgress?.({ stage: 'refit', evaluated: outcome.evaluated, rejected: outcome.rejected, total });

  const context: ModelContext = {
    training,
    validation,
    reference: set.reference ? { term: set.reference, coefficient: settings.reference!.coefficient } : null,
    trainingSignals,
  };
  const criterion: RankingCriterion = validation ? 'validation' : 'bic';
  const termsOf = (model: WorkedModel) => [
    ...model.columns.map((j) => training.terms[j]!),
    ...(context.reference ? [context.reference.term] : []),
  ];
  const normal = createNormalRandom(createSeededRandom(NOISE_SEED));
  const floorOf = (model: WorkedModel) =>
    noiseFloorRmse({ terms: termsOf(model), coefficients: model.coefficients }, train, settings, symbols, needAccelerations, normal);
  const front = sizeFront(outcome, context, sizes, floorOf);
  // Validation error measures directly what the stop guards against, so the stop serves ranking by BIC.
  const stop =
    criterion === 'bic'
      ? front.find((entry) => entry.noiseFloorRmse !== null && entry.trainRmse <= NOISE_FLOOR_FACTOR * entry.noiseFloorRmse)
      : undefined;
  if (stop && stop.size < sizes.max) {
    warnings.push(
      `Models stop growing at size ${stop.size}: its best model's residual (${stop.trainRmse.toPrecision(3)}) is within ` +
        `${NOISE_FLOOR_FACTOR} times the residual the noise in the recordings alone gives it ` +
        `(${stop.noiseFloorRmse!.toPrecision(3)}), so larger models are ranked after it.`,
    );
  }
  const worked = leaderboardSubsets(outcome).map((subset) => workOutModel(subset, context));
  const rule = rankingRule(worked, criterion, stop?.size ?? null, (model) =>
    noiseFloorRmse({ terms: termsOf(model), coefficients: model.coefficients }, validate, settings, symbols, needAccelerations, normal),
  );
  const ranked = rankModels(worked, rule).slice(0, settings.top);
  const ambiguity = indistinguishableWarning(ranked, rule, termsOf, trainingSignals);
  if (ambiguity) warnings.push(ambiguity);
  const best = ranked[0];

  return {
    evaluated: outcome.evaluated,
    rejected: outcome.rejected,
    seconds: (performance.now() - startedAt) / 1000,
    form: settings.form,
    balance: settings.form === 'balance' ? settings.balance : null,
    signals: signalReport(settings, recordings, needAccelerations),
    trainingRows: training.rowCount,
    validationRows: validation?.rowCount ?? null,
    candidateCount,
    known: set.known.map((t) => t.text),
    reference: set.reference ? { term: set.reference.text, coefficient: settings.reference!.coefficient } : null,
    rankedBy: criterion,
    rankingTolerance: rule.tolerance,
    models: ranked.map(({ columns: _columns, ...model }) => model),
    front,
    best: best
      ? {
          terms: best.terms,
          coefficients: best.coefficients,
          energy: best.energy,
          lagrangian: best.lagrangian,
          notIdentifiable: best.notIdentifiable,
        }
      : null,
    excluded,
    warnings,
    caution: safetyCaution,
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

function checkKnownColumns(columns: Float64Array[], rhs: Float64Array, names: string[]): void {
  if (columns.length < 2) return;
  const fit = refitColumns(columns, rhs);
  if (!(fit.conditionNumber < KNOWN_CONDITION_LIMIT)) {
    throw new DiscoveryInputError(
      `The known terms ${names.slice(0, columns.length).join(', ')} are linearly dependent on the training data ` +
        `(condition number ${fit.conditionNumber.toPrecision(3)}); remove one of them.`,
    );
  }
}

/**
 * The ranking rule: criterion, tolerance and stop. With validation recordings the tolerance also covers the
 * validation residual that noise alone gives the best model on those recordings.
 */
function rankingRule(
  models: WorkedModel[],
  criterion: RankingCriterion,
  stopSize: number | null,
  validationFloorOf: (model: WorkedModel) => number,
): RankingRule {
  if (criterion === 'bic' || models.length === 0) return { criterion, tolerance: rankingTolerance(criterion, null, null), stopSize };
  const best = models.reduce((a, b) => (scoreOf(b, criterion) < scoreOf(a, criterion) ? b : a));
  return { criterion, tolerance: rankingTolerance(criterion, best.validationRmse, validationFloorOf(best)), stopSize };
}

/** The best subsets overall and of every size, each once. */
function leaderboardSubsets(outcome: SweepOutcome): RankedSubset[] {
  const seen = new Set<string>();
  const subsets: RankedSubset[] = [];
  for (const subset of [...outcome.best, ...Object.values(outcome.bestBySize).flat()]) {
    const key = subset.members.join(',');
    if (seen.has(key)) continue;
    seen.add(key);
    subsets.push(subset);
  }
  return subsets;
}

/** The best model of each size by training residual, with its noise floor: the front of error against size. */
function sizeFront(
  outcome: SweepOutcome,
  context: ModelContext,
  sizes: { min: number; max: number },
  floorOf: (model: WorkedModel) => number,
): SizeFrontEntry[] {
  const front: SizeFrontEntry[] = [];
  for (let size = sizes.min; size <= sizes.max; size++) {
    const first = outcome.bestBySize[size]?.[0];
    if (!first) continue;
    const model = workOutModel(first, context);
    front.push({
      size,
      terms: model.terms,
      trainRmse: model.trainRmse,
      validationRmse: model.validationRmse,
      bic: model.bic,
      noiseFloorRmse: floorOf(model),
    });
  }
  return front;
}

function signalReport(settings: SweepSettings, recordings: readonly Recording[], needAccelerations: boolean): DiscoveryResult['signals'] {
  const measured = recordings.flatMap((r) => r.velocities.map((v) => v !== null));
  const velocities = measured.every(Boolean) ? 'measured' : measured.some(Boolean) ? 'measured and estimated' : 'estimated';
  return {
    estimator: settings.derivatives,
    description: describeEstimator(settings.derivatives),
    velocities,
    accelerations: needAccelerations ? 'estimated' : 'not needed',
  };
}


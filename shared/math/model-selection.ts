import type { CoefficientNoiseReport, CoordinateNoise, SizeFrontEntry } from '../schemas/discovery-result.js';
import type { SweepSettings } from '../schemas/sweep-description.js';
import type { PreparedDiscovery } from './discovery-preparation.js';
import { workOutModel, type ModelContext, type WorkedModel } from './leaderboard-models.js';
import {
  indistinguishableWarning,
  rankingTolerance,
  rankModels,
  scoreOf,
  type RankingCriterion,
  type RankingRule,
} from './model-choice.js';
import { energyOnSamples } from './energy-on-samples.js';
import { kineticDegeneracy, type KineticDegeneracy } from './kinetic-degeneracy.js';
import { dropNegligibleTerms, NEGLIGIBLE_ENERGY_CHANGE, type Simplification } from './negligible-terms.js';
import { diagnoseNoise } from './noise-diagnosis.js';
import { NOISE_FLOOR_FACTOR, noiseFloorRmse } from './noise-floor.js';
import { createNormalRandom, createSeededRandom } from './seeded-random.js';
import type { RankedSubset, SweepOutcome } from './sweep-problem.js';

/** Fixed seed of the noise draws, so a discovery gives the same result every time it runs. */
const NOISE_SEED = 20261202;

export interface ModelSelection {
  /** Best first, at most `top`. */
  ranked: WorkedModel[];
  front: SizeFrontEntry[];
  rule: RankingRule;
  /** The first-ranked model's terms and the negligible terms left out of it, when any were. */
  simplification: { from: string[]; dropped: Simplification['dropped']; tolerance: number } | null;
  /** How noisy each coordinate's training signals are. */
  signalNoise: CoordinateNoise[];
  /** How far noise of the recorded size moves the first model's coefficients. */
  coefficientNoise: CoefficientNoiseReport | null;
  warnings: string[];
}

/**
 * The finish step (design: "finish"): re-fits the leaderboard, measures each size's best model against its
 * noise floor (the front of error against size), stops growth at the floor when ranking by BIC, ranks the
 * models (model-choice.ts), leaves negligible terms out of the first one (negligible-terms.ts), and warns when
 * the data do not decide (model-choice.ts), the chosen energy cannot drive every coordinate
 * (kinetic-degeneracy.ts), noise is large enough to bias the coefficients, or the chosen model leaves more
 * unexplained than noise accounts for (noise-diagnosis.ts).
 */
export function selectModels(prepared: PreparedDiscovery, settings: SweepSettings, outcome: SweepOutcome): ModelSelection {
  const warnings: string[] = [];
  const reference = prepared.set.reference;
  const context: ModelContext = {
    training: prepared.training,
    validation: prepared.validation,
    reference: reference ? { term: reference, coefficient: settings.reference!.coefficient } : null,
    trainingSignals: prepared.trainingSignals,
  };
  const termsOf = (model: WorkedModel) => [
    ...model.columns.map((j) => prepared.training.terms[j]!),
    ...(context.reference ? [context.reference.term] : []),
  ];
  const normal = createNormalRandom(createSeededRandom(NOISE_SEED));
  const floorOn = (recordings: PreparedDiscovery['train']) => (model: WorkedModel) =>
    noiseFloorRmse({ terms: termsOf(model), coefficients: model.coefficients }, recordings, settings, prepared.symbols, prepared.needAccelerations, normal);

  const criterion: RankingCriterion = prepared.validation ? 'validation' : 'bic';
  const front = sizeFront(outcome, context, prepared.sizes, floorOn(prepared.train));
  // Validation error measures directly what the stop guards against, so the stop serves ranking by BIC.
  const stop =
    criterion === 'bic'
      ? front.find((entry) => entry.noiseFloorRmse !== null && entry.trainRmse <= NOISE_FLOOR_FACTOR * entry.noiseFloorRmse)
      : undefined;
  if (stop && stop.size < prepared.sizes.max) {
    warnings.push(
      `Models stop growing at size ${stop.size}: its best model's residual (${stop.trainRmse.toPrecision(3)}) is within ` +
        `${NOISE_FLOOR_FACTOR} times the residual the noise in the recordings alone gives it ` +
        `(${stop.noiseFloorRmse!.toPrecision(3)}), so larger models are ranked after it.`,
    );
  }

  const worked = leaderboardSubsets(outcome).map((subset) => workOutModel(subset, context));
  const rule = rankingRule(worked, criterion, stop?.size ?? null, floorOn(prepared.validate));
  const energyOf = (model: WorkedModel) => energyOnSamples(termsOf(model), model.coefficients, prepared.trainingSignals);
  const { ranked: all, simplification } = simplifyChosen(rankModels(worked, rule), context, prepared.sizes.min, energyOf);
  if (simplification) warnings.push(simplificationWarning(simplification));
  const ranked = all.slice(0, settings.top);
  const ambiguity = indistinguishableWarning(ranked, rule, termsOf, prepared.trainingSignals);
  if (ambiguity) warnings.push(ambiguity);
  const chosen = ranked[0];
  const degeneracy = chosen
    ? kineticDegeneracy(termsOf(chosen), chosen.coefficients, prepared.trainingSignals, prepared.symbols.velocities)
    : null;
  if (degeneracy) warnings.push(degeneracyWarning(degeneracy, prepared.symbols.velocities));
  const noise = diagnoseNoise(prepared, settings, chosen, floorOn(prepared.train), normal);
  warnings.push(...noise.warnings);
  return { ranked, front, rule, simplification, signalNoise: noise.signalNoise, coefficientNoise: noise.coefficientNoise, warnings };
}

/**
 * Drops the negligible terms of the first-ranked model (negligible-terms.ts) and puts the simplified model
 * first; the model it came from follows it, so the leaderboard still shows what the ranking chose.
 */
function simplifyChosen(
  ranked: WorkedModel[],
  context: ModelContext,
  minSize: number,
  energyOf: (model: WorkedModel) => Float64Array,
): { ranked: WorkedModel[]; simplification: ModelSelection['simplification'] } {
  const [first] = ranked;
  if (!first) return { ranked, simplification: null };
  const { model, dropped } = dropNegligibleTerms(first, context, minSize, energyOf);
  if (dropped.length === 0) return { ranked, simplification: null };
  const key = (m: WorkedModel) => m.columns.join(',');
  return {
    ranked: [model, ...ranked.filter((m) => key(m) !== key(model))],
    simplification: { from: first.terms, dropped, tolerance: NEGLIGIBLE_ENERGY_CHANGE },
  };
}

function simplificationWarning(simplification: NonNullable<ModelSelection['simplification']>): string {
  const dropped = simplification.dropped.map(
    (d) => `${d.term} (coefficient ${d.coefficient.toPrecision(3)}; energy change ${d.energyChange.toExponential(1)})`,
  );
  return (
    `The first-ranked model (${simplification.from.join(', ')}) was simplified by leaving out ${dropped.join(', ')}: ` +
    `without ${dropped.length > 1 ? 'them' : 'it'} the energy changes by less than ${simplification.tolerance} of its ` +
    'variation on the training samples, too little to matter; such a term fits the error of the estimated signals ' +
    'rather than the motion. The simpler model ranks first, the one it came from second.'
  );
}

function degeneracyWarning(degeneracy: KineticDegeneracy, velocities: readonly string[]): string {
  const component = (v: number) => (Math.abs(v) < 5e-3 ? '0' : Math.abs(v - 1) < 5e-3 ? '1' : v.toFixed(2));
  const where = `on ${(100 * degeneracy.share).toFixed(0)} % of the training samples`;
  const what = degeneracy.everyDirection
    ? `The chosen energy has next to no kinetic part ${where} (below ${NEGLIGIBLE_ENERGY_CHANGE} of the energy's ` +
      'variation for velocities of the recorded size), so its Lagrangian cannot say how the mechanism moves.'
    : `The chosen energy hardly changes with the velocities along ${velocities.join(' : ')} = ` +
      `${degeneracy.direction.map(component).join(' : ')} ${where} (its kinetic part there is below ` +
      `${NEGLIGIBLE_ENERGY_CHANGE} of the energy's variation, or negative), so its Lagrangian cannot say how the ` +
      'mechanism moves in that direction.';
  const advice = degeneracy.everyDirection
    ? 'The data do not decide the kinetic part of the energy: check the candidate terms, the derivative estimator and ' +
      'the noise in the recordings.'
    : 'The data do not decide that part of the energy; with passive recordings, often because they conserve a ' +
      'momentum as well as the energy. Add recordings forced in that direction, or name a kinetic term for it as ' +
      'known or as the reference.';
  return `${what} ${advice}`;
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

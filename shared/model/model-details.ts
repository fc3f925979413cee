import { DiscoveryInputError } from '../math/discovery-input-error.js';
import { checkMassMatrix } from '../math/mass-matrix-check.js';
import { compileModelDynamics, type ModelDynamics } from '../math/model-dynamics.js';
import { compileModelEnergy, type ModelEnergy } from '../math/model-energy.js';
import { simulateModel, type ModelSimulation } from '../math/model-simulation.js';
import { trajectoryComparison, validateSimulation } from '../math/model-validation.js';
import type { Recording } from '../math/recording.js';
import { recordingStates } from '../math/recording-states.js';
import type { FitResidual, ModelDetails, RecordingCheck } from '../schemas/model-details.js';
import type { ModelDocument } from '../schemas/model-document.js';
import type { MassMatrixCheck, ModelCheckSettings } from '../schemas/model-validation.js';
import { defaultDerivativeSettings, type BalanceSettings } from '../schemas/sweep-description.js';
import { modelLatex } from './export-latex.js';
import { fitResidualOn, residualFormOf, residualModel, type ResidualModel } from './fit-residual.js';
import { documentEquations } from './model-document.js';
import { safetyCaution } from './safety-caution.js';

/** Error threshold used when none is asked for, in coordinate units (common practice, no source). */
export const DEFAULT_ERROR_THRESHOLD = 0.05;
export const DEFAULT_SIMULATION_RTOL = 1e-9;
/** Samples kept per series for plots. */
export const DEFAULT_PLOT_POINTS = 600;

export interface ModelCheckOptions {
  threshold?: number;
  /** Default: the estimator the model's sweep used, else the sweep default. */
  estimator?: ModelCheckSettings['estimator'];
  forceInterpolation?: ModelCheckSettings['forceInterpolation'];
  rtol?: number;
  /** Samples kept per plotted series (default 600). */
  plotPoints?: number;
  /** Regression form of the fit residual; default: the form the document's sweep used, else balance. */
  form?: 'derivative' | 'balance';
  /** Balance windows of the fit residual; default: the document's sweep's, else the description defaults. */
  balance?: BalanceSettings;
}

/** A model compiled once for checks on many recordings. */
export interface CompiledModel {
  document: ModelDocument;
  dynamics: ModelDynamics;
  energy: ModelEnergy;
  settings: ModelCheckSettings;
  plotPoints: number;
  /** The energy compiled for its balance residual in the sweep's form. */
  residual: ResidualModel;
}

/** Compiles a model document's equations of motion and energy with the check settings filled in. */
export function compileModel(document: ModelDocument, options: ModelCheckOptions = {}): CompiledModel {
  const threshold = options.threshold ?? DEFAULT_ERROR_THRESHOLD;
  if (!(threshold > 0) || !Number.isFinite(threshold)) throw new DiscoveryInputError(`The error threshold must be a positive number (got ${threshold}).`);
  const estimator = options.estimator ?? document.provenance.estimator ?? defaultDerivativeSettings;
  const residualForm = residualFormOf(document, {
    ...(options.form ? { form: options.form } : {}),
    ...(options.balance ? { balance: options.balance } : {}),
  });
  return {
    document,
    dynamics: compileModelDynamics(documentEquations(document)),
    energy: compileModelEnergy(
      document.coordinates,
      document.energy.terms.map((t) => t.term),
      document.energy.terms.map((t) => t.coefficient),
    ),
    settings: {
      threshold,
      estimator,
      forceInterpolation: options.forceInterpolation ?? 'cubic',
      rtol: options.rtol ?? DEFAULT_SIMULATION_RTOL,
    },
    plotPoints: options.plotPoints ?? DEFAULT_PLOT_POINTS,
    residual: residualModel(document, residualForm, estimator),
  };
}

/** What one recording says about a model: the mass-matrix check, and the simulation with its figures when asked for. */
export interface RecordingOutcome {
  massMatrix: MassMatrixCheck;
  simulation: ModelSimulation | null;
  check: RecordingCheck | null;
}

/**
 * Checks a model on one recording: the mass matrix on every recorded state, then (when `simulate`) the
 * simulation from the recording's initial state driven by its forces, compared with it. Throws
 * DiscoveryInputError when the recording does not fit the model (coordinate count) or is too short for the
 * estimator.
 */
export function checkModelOnRecording(model: CompiledModel, recording: Recording, simulate = true): RecordingOutcome {
  const { document, dynamics, energy, settings } = model;
  if (recording.positions.length !== document.coordinates.length) {
    throw new DiscoveryInputError(
      `${recording.name} has ${recording.positions.length} coordinate columns; the model has ${document.coordinates.length} (${document.coordinates.join(', ')}).`,
    );
  }
  const states = recordingStates(recording, document.coordinates, settings.estimator);
  const massMatrix = checkMassMatrix(dynamics, states);
  if (!simulate) return { massMatrix, simulation: null, check: null };
  const simulation = simulateModel(dynamics, recording, states, {
    forceInterpolation: settings.forceInterpolation,
    rtol: settings.rtol,
    atol: settings.rtol * 1e-3,
  });
  return {
    massMatrix,
    simulation,
    check: {
      figures: validateSimulation(recording, document.coordinates, simulation, energy, { threshold: settings.threshold }),
      trajectory: trajectoryComparison(recording, document.coordinates, simulation, model.plotPoints),
    },
  };
}

/**
 * Everything the model view needs about one model (shared/schemas/model-details.ts), computed once: the
 * document, its formulas as LaTeX, the mass-matrix check and the fit's energy-balance residual on every
 * recording, and the simulation against every validation recording (against the training recordings when there is none, with a warning). A recording that
 * cannot be used is named in the warnings instead of failing the whole. Pure: no I/O.
 */
export function workOutModelDetails(document: ModelDocument, recordings: readonly Recording[], options: ModelCheckOptions = {}): ModelDetails {
  const model = compileModel(document, options);
  const warnings: string[] = [];
  if (document.equations.leftOut.length > 0) {
    warnings.push(
      `Left out of the equations of motion (their Lagrangian coefficient cannot be found from the energy): ${document.equations.leftOut.join(', ')}.`,
    );
  }
  const validating = recordings.filter((r) => r.role === 'validate');
  const simulated = validating.length > 0 ? validating : recordings.filter((r) => r.role === 'train');
  if (validating.length === 0 && recordings.length > 0) {
    warnings.push('No validation recording: the model is simulated against its training recordings, which it was fitted to.');
  }
  const massMatrixChecks: MassMatrixCheck[] = [];
  const validations: RecordingCheck[] = [];
  const residuals: FitResidual[] = [];
  for (const recording of recordings) {
    try {
      residuals.push(fitResidualOn(model.residual, recording, model.plotPoints));
    } catch (error) {
      if (!(error instanceof DiscoveryInputError)) throw error;
      warnings.push(`No fit residual on ${recording.name}: ${error.message}`);
    }
    let outcome: RecordingOutcome;
    try {
      outcome = checkModelOnRecording(model, recording, simulated.includes(recording));
    } catch (error) {
      if (!(error instanceof DiscoveryInputError)) throw error;
      warnings.push(`${recording.name} could not be used: ${error.message}`);
      continue;
    }
    massMatrixChecks.push(outcome.massMatrix);
    if (outcome.massMatrix.notPositiveDefinite > 0) {
      warnings.push(
        `The mass matrix is not positive definite on ${outcome.massMatrix.notPositiveDefinite} of ${outcome.massMatrix.checkedStates} states of ${recording.name}.`,
      );
    }
    if (!outcome.check || !outcome.simulation) continue;
    validations.push(outcome.check);
    if (outcome.simulation.message) warnings.push(`${recording.name}: ${outcome.simulation.message}.`);
  }
  return {
    document,
    latex: modelLatex(document),
    settings: model.settings,
    massMatrixChecks,
    validations,
    fitResiduals: {
      form: model.residual.settings.form,
      balance: model.residual.settings.form === 'balance' ? model.residual.settings.balance : null,
      recordings: residuals,
    },
    warnings,
    caution: safetyCaution,
  };
}

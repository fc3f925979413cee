import { prepareTerm, type CandidateTerm } from '../math/candidate-term.js';
import { energyBalanceResidual } from '../math/energy-balance-residual.js';
import { rootMeanSquare } from '../math/form-rows.js';
import type { Recording } from '../math/recording.js';
import { recordingSignals } from '../math/recording-signals.js';
import type { FormSettings } from '../math/regression-system.js';
import { TermSymbols } from '../math/term-symbols.js';
import { thinnedIndices } from '../math/thinned-indices.js';
import type { FitResidual } from '../schemas/model-details.js';
import type { ModelDocument } from '../schemas/model-document.js';
import { balanceSettingsSchema, defaultBalanceSettings, type DerivativeSettings } from '../schemas/sweep-description.js';

/** A model's energy ready for its balance residual: the form's settings and the compiled energy terms. */
export interface ResidualModel {
  settings: FormSettings;
  symbols: TermSymbols;
  terms: CandidateTerm[];
  coefficients: number[];
  estimator: DerivativeSettings;
  needAccelerations: boolean;
}

/**
 * The regression form of the model's sweep (balance when the document names none, as a description without
 * `form` does) and its balance windows as the sweep ran them, or the defaults when the document does not say.
 */
export function residualFormOf(document: ModelDocument, asked: Partial<Pick<FormSettings, 'form' | 'balance'>> = {}): Pick<FormSettings, 'form' | 'balance'> {
  const stored = balanceSettingsSchema.safeParse(document.provenance.sweep?.['balance'] ?? defaultBalanceSettings);
  return {
    form: asked.form ?? document.provenance.form ?? 'balance',
    balance: asked.balance ?? (stored.success ? stored.data : { ...defaultBalanceSettings }),
  };
}

/** Compiles the model's energy terms for the residual in the given form, with the given derivative estimator. */
export function residualModel(document: ModelDocument, form: Pick<FormSettings, 'form' | 'balance'>, estimator: DerivativeSettings): ResidualModel {
  const symbols = new TermSymbols(document.coordinates);
  const terms = document.energy.terms.map((t) => prepareTerm(t.term, symbols));
  return {
    settings: { form: form.form, balance: form.balance },
    symbols,
    terms,
    coefficients: document.energy.terms.map((t) => t.coefficient),
    estimator,
    needAccelerations: form.form === 'derivative' && terms.some((t) => t.needsAcceleration),
  };
}

/**
 * The energy-balance residual of the model on one recording (energyBalanceResidual, on the recording's signals
 * estimated as the sweep estimated them), with its figures and a series thinned to `plotPoints` rows. Throws
 * DiscoveryInputError when the recording is too short for the estimator or for a balance window.
 */
export function fitResidualOn(model: ResidualModel, recording: Recording, plotPoints: number): FitResidual {
  const signals = recordingSignals(recording, model.symbols, model.estimator, model.needAccelerations);
  const rows = energyBalanceResidual(model.settings, signals, model.terms, model.coefficients);
  const picked = thinnedIndices(rows.residual.length, plotPoints).indices;
  let max = 0;
  for (const value of rows.residual) max = Math.max(max, Math.abs(value));
  return {
    recording: recording.name,
    role: recording.role,
    rows: rows.residual.length,
    rms: rootMeanSquare(rows.residual),
    max,
    powerRms: rootMeanSquare(rows.power),
    partsRms: rootMeanSquare(rows.parts),
    time: picked.map((k) => rows.time[k]!),
    residual: picked.map((k) => rows.residual[k]!),
  };
}

import path from 'node:path';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import { parseCommandArguments } from './command-arguments.js';

const usage =
  'simulate takes a model document and one recording: conserva simulate <model.json> <recording.csv> [--json] ' +
  '[--threshold <error>] [--columns <name>=<column>,...] [--forces cubic|linear|hold] [--points <count>]';

/**
 * `conserva simulate <model.json> <recording.csv>`: drives the model through the recording from its initial
 * state with its recorded forces, and prints the simulated trajectory and the error figures (one JSON object
 * with --json, else a summary).
 */
export async function runSimulate(args: readonly string[]): Promise<number> {
  const parsed = parseCommandArguments(args, { flags: ['--json'], values: ['--threshold', '--columns', '--forces', '--points'] });
  if (parsed.positionals.length !== 2) throw new DiscoveryInputError(usage);
  const threshold = positiveNumber(parsed.values.get('--threshold'), '--threshold');
  const points = parsed.values.has('--points') ? wholeNumber(parsed.values.get('--points')!, '--points') : undefined;
  const forces = parsed.values.get('--forces');
  if (forces !== undefined && !['cubic', 'linear', 'hold'].includes(forces)) {
    throw new DiscoveryInputError(`--forces must be cubic, linear or hold (got "${forces}").`);
  }
  const [modelFile, recordingFile] = parsed.positionals as [string, string];
  const { readText } = await import('./read-recordings.js');
  const modelText = await readText(modelFile, 'model document');
  const csvText = await readText(recordingFile, 'recording');

  const { parseModelDocument } = await import('../../../shared/model/model-document.js');
  const { parseCsvTable, recordingFromCsv } = await import('../../../shared/math/csv-recording.js');
  const { simulationColumns } = await import('./simulation-columns.js');
  const { compileModel, checkModelOnRecording } = await import('../../../shared/model/model-details.js');
  const { trajectoryComparison } = await import('../../../shared/math/model-validation.js');
  const { safetyCaution } = await import('../../../shared/model/safety-caution.js');
  const { simulationSummary } = await import('./simulation-summary.js');

  const document = parseModelDocument(modelText, modelFile);
  const name = path.basename(recordingFile);
  const { mapping, used } = simulationColumns(parseCsvTable(csvText, name).header, document.coordinates, parsed.values.get('--columns'), name);
  const recording = recordingFromCsv(csvText, name, 'validate', document.coordinates, mapping);
  const model = compileModel(document, {
    ...(threshold !== undefined ? { threshold } : {}),
    ...(forces !== undefined ? { forceInterpolation: forces as 'cubic' | 'linear' | 'hold' } : {}),
  });
  const outcome = checkModelOnRecording(model, recording);
  const warnings: string[] = [];
  if (outcome.simulation!.message) warnings.push(outcome.simulation!.message);
  if (outcome.massMatrix.notPositiveDefinite > 0) {
    warnings.push(`The mass matrix is not positive definite on ${outcome.massMatrix.notPositiveDefinite} of ${outcome.massMatrix.checkedStates} recorded states.`);
  }
  if (document.equations.leftOut.length > 0) warnings.push(`Left out of the equations of motion: ${document.equations.leftOut.join(', ')}.`);
  const result = {
    model: {
      title: document.title,
      coordinates: document.coordinates,
      energy: document.energy.expression,
      lagrangian: document.lagrangian.expression,
    },
    recording: name,
    columns: used,
    settings: model.settings,
    figures: outcome.check!.figures,
    massMatrix: outcome.massMatrix,
    trajectory: trajectoryComparison(recording, document.coordinates, outcome.simulation!, points ?? Number.MAX_SAFE_INTEGER),
    warnings,
    caution: safetyCaution,
  };
  process.stdout.write(parsed.flags.has('--json') ? `${JSON.stringify(result)}\n` : `${simulationSummary(result)}\n`);
  return 0;
}

function positiveNumber(text: string | undefined, option: string): number | undefined {
  if (text === undefined) return undefined;
  const value = Number(text);
  if (!(value > 0) || !Number.isFinite(value)) throw new DiscoveryInputError(`${option} must be a positive number (got "${text}").`);
  return value;
}

function wholeNumber(text: string, option: string): number {
  const value = Number(text);
  if (!Number.isInteger(value) || value < 2) throw new DiscoveryInputError(`${option} must be a whole number of at least 2 (got "${text}").`);
  return value;
}

import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import { parseCommandArguments } from './command-arguments.js';

/**
 * `conserva discover <description.json> [--json] [--model-out <model.json>]`: runs the whole discovery and
 * prints the result (one JSON object with --json, else a table); --model-out also writes the best model as a
 * model document, ready for `conserva simulate`.
 */
export async function runDiscover(args: readonly string[]): Promise<number> {
  const parsed = parseCommandArguments(args, { flags: ['--json'], values: ['--model-out'] });
  if (parsed.positionals.length !== 1) {
    throw new DiscoveryInputError('discover takes exactly one description file: conserva discover <description.json> [--json] [--model-out <model.json>]');
  }
  // Loaded step by step so that usage errors and unreadable files are answered before the math engine loads.
  const { readDescription, readRecordings } = await import('./read-recordings.js');
  const descriptionFile = parsed.positionals[0]!;
  const description = await readDescription(descriptionFile);
  const recordings = await readRecordings(description, descriptionFile);
  const { discover } = await import('../../../shared/math/discover.js');
  const { progressReporter } = await import('./progress-reporter.js');
  const { summaryText } = await import('./summary-table.js');
  const result = discover(description, recordings, {
    onProgress: progressReporter((line) => process.stderr.write(`${line}\n`)),
  });
  process.stdout.write(parsed.flags.has('--json') ? `${JSON.stringify(result)}\n` : `${summaryText(result)}\n`);

  const modelOut = parsed.values.get('--model-out');
  if (modelOut === undefined) return 0;
  const best = result.models[0];
  if (!best) throw new DiscoveryInputError(`No model to write to ${modelOut}: every subset was rank deficient.`);
  const { modelDocumentFromDiscovery, serializeModelDocument } = await import('../../../shared/model/model-document.js');
  const { recordings: files, columns: _columns, ...settings } = description;
  const document = modelDocumentFromDiscovery(
    best,
    description.coordinates,
    {
      source: 'conserva discover',
      form: result.form,
      estimator: description.derivatives,
      recordings: files.map((r) => ({ name: r.file, role: r.role })),
      sweep: settings as Record<string, unknown>,
      scores: null,
    },
    `best model of ${path.basename(descriptionFile)}`,
  );
  try {
    await writeFile(modelOut, serializeModelDocument(document));
  } catch (error) {
    throw new DiscoveryInputError(`Cannot write the model to ${modelOut}: ${(error as Error).message}`);
  }
  process.stderr.write(`model written to ${modelOut}\n`);
  return 0;
}

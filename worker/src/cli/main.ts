/**
 * The command-line tool: `npm run --silent conserva -- discover <description.json> [--json]`.
 * Standard output carries the result only (one JSON object with --json); progress and errors go to
 * standard error. Exit 0 on success, 2 for an invalid description or recording, 1 for anything else.
 */
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import { helpText } from './help-text.js';

const EXIT_INVALID_INPUT = 2;
const EXIT_FAULT = 1;

async function main(args: string[]): Promise<number> {
  if (args.length === 0 || args.includes('--help') || args.includes('-h') || args[0] === 'help') {
    process.stdout.write(helpText);
    return args.length === 0 ? EXIT_INVALID_INPUT : 0;
  }
  const [command, ...rest] = args;
  if (command !== 'discover') {
    process.stderr.write(`Unknown command "${command}". Run conserva --help for usage.\n`);
    return EXIT_INVALID_INPUT;
  }
  const json = rest.includes('--json');
  const unknownFlags = rest.filter((a) => a.startsWith('-') && a !== '--json');
  const files = rest.filter((a) => !a.startsWith('-'));
  if (unknownFlags.length > 0 || files.length !== 1) {
    process.stderr.write(
      unknownFlags.length > 0
        ? `Unknown option ${unknownFlags.join(', ')}. Run conserva --help for usage.\n`
        : 'discover takes exactly one description file: conserva discover <description.json> [--json]\n',
    );
    return EXIT_INVALID_INPUT;
  }
  // Loaded step by step so that usage errors and unreadable files are answered before the math engine loads.
  const { readDescription, readRecordings } = await import('./read-recordings.js');
  const descriptionFile = files[0]!;
  const description = await readDescription(descriptionFile);
  const recordings = await readRecordings(description, descriptionFile);
  const { discover } = await import('../../../shared/math/discover.js');
  const { progressReporter } = await import('./progress-reporter.js');
  const { summaryText } = await import('./summary-table.js');
  const result = discover(description, recordings, {
    onProgress: progressReporter((line) => process.stderr.write(`${line}\n`)),
  });
  process.stdout.write(json ? `${JSON.stringify(result)}\n` : `${summaryText(result)}\n`);
  return 0;
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    if (error instanceof DiscoveryInputError) {
      process.stderr.write(`${error.message}\n`);
      process.exitCode = EXIT_INVALID_INPUT;
    } else {
      process.stderr.write(`conserva: unexpected failure: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
      process.exitCode = EXIT_FAULT;
    }
  },
);

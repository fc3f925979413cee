/**
 * The command-line tool: `npm run --silent conserva -- discover <description.json> [--json] [--model-out <file>]`
 * and `npm run --silent conserva -- simulate <model.json> <recording.csv> [--json] [options]`.
 * Standard output carries the result only (one JSON object with --json); progress and errors go to
 * standard error. Exit 0 on success, 2 for invalid input (description, model, recording, options), 1 for
 * anything else.
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
  if (command === 'discover') return (await import('./discover-command.js')).runDiscover(rest);
  if (command === 'simulate') return (await import('./simulate-command.js')).runSimulate(rest);
  process.stderr.write(`Unknown command "${command}". Run conserva --help for usage.\n`);
  return EXIT_INVALID_INPUT;
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

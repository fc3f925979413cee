import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';

export interface CommandArguments {
  flags: Set<string>;
  values: Map<string, string>;
  positionals: string[];
}

/**
 * Splits a command's arguments into known flags (`--json`), options with a value (`--threshold 0.1` or
 * `--threshold=0.1`) and positional arguments. Unknown options and options without their value are refused
 * with DiscoveryInputError (exit 2).
 */
export function parseCommandArguments(args: readonly string[], spec: { flags: string[]; values: string[] }): CommandArguments {
  const parsed: CommandArguments = { flags: new Set(), values: new Map(), positionals: [] };
  const unknown: string[] = [];
  for (let k = 0; k < args.length; k++) {
    const arg = args[k]!;
    if (!arg.startsWith('-') || arg === '-') {
      parsed.positionals.push(arg);
      continue;
    }
    const [name, inline] = arg.includes('=') ? [arg.slice(0, arg.indexOf('=')), arg.slice(arg.indexOf('=') + 1)] : [arg, undefined];
    if (spec.flags.includes(name) && inline === undefined) parsed.flags.add(name);
    else if (spec.values.includes(name)) {
      const value = inline ?? args[++k];
      if (value === undefined || value === '') throw new DiscoveryInputError(`${name} needs a value. Run conserva --help for usage.`);
      parsed.values.set(name, value);
    } else unknown.push(arg);
  }
  if (unknown.length > 0) throw new DiscoveryInputError(`Unknown option ${unknown.join(', ')}. Run conserva --help for usage.`);
  return parsed;
}

import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import type { ColumnMapping } from '../../../shared/schemas/sweep-description.js';

/**
 * Which CSV columns `simulate` reads. By default: `time`, a column named like each coordinate, its velocity
 * `d<name>` when the file has one (else the velocity is estimated), and its generalized force `u_<name>` when
 * the file has one (else zero). `--columns time=t,th=angle,u_th=torque` maps other names; a mapped column must
 * exist. Returns the mapping for recordingFromCsv and the pairs used, for the output.
 */
export function simulationColumns(
  header: readonly string[],
  coordinates: readonly string[],
  option: string | undefined,
  fileName: string,
): { mapping: ColumnMapping; used: Record<string, string> } {
  const overrides = parseColumnsOption(option, coordinates);
  const pick = (key: string, required: boolean): string | null => {
    const mapped = overrides.get(key);
    if (mapped !== undefined) {
      if (!header.includes(mapped)) {
        throw new DiscoveryInputError(`${fileName} has no column "${mapped}" (mapped to ${key} by --columns; its columns: ${header.map((h) => `"${h}"`).join(', ')}).`);
      }
      return mapped;
    }
    if (header.includes(key)) return key;
    if (required) {
      throw new DiscoveryInputError(
        `${fileName} has no column "${key}" (its columns: ${header.map((h) => `"${h}"`).join(', ')}); map another one with --columns ${key}=<column>.`,
      );
    }
    return null;
  };
  const used: Record<string, string> = {};
  const mapping: ColumnMapping = { time: pick('time', true)! };
  used['time'] = mapping.time;
  const forces: Record<string, string> = {};
  for (const coordinate of coordinates) {
    const position = pick(coordinate, true)!;
    mapping[coordinate] = position;
    used[coordinate] = position;
    const velocity = pick(`d${coordinate}`, false);
    if (velocity !== null) mapping[`d${coordinate}`] = used[`d${coordinate}`] = velocity;
    const force = pick(`u_${coordinate}`, false);
    if (force !== null) forces[coordinate] = used[`u_${coordinate}`] = force;
  }
  if (Object.keys(forces).length > 0) mapping.forces = forces;
  return { mapping, used };
}

function parseColumnsOption(option: string | undefined, coordinates: readonly string[]): Map<string, string> {
  const overrides = new Map<string, string>();
  if (option === undefined) return overrides;
  const allowed = new Set(['time', ...coordinates, ...coordinates.map((c) => `d${c}`), ...coordinates.map((c) => `u_${c}`)]);
  for (const pair of option.split(',')) {
    const [key, column, ...rest] = pair.split('=').map((part) => part.trim());
    if (!key || !column || rest.length > 0) {
      throw new DiscoveryInputError(`--columns: "${pair}" is not of the form <name>=<column> (for example time=t,th=angle,u_th=torque).`);
    }
    if (!allowed.has(key)) {
      throw new DiscoveryInputError(`--columns: "${key}" is neither time, a coordinate of the model, its velocity d<name> nor its force u_<name> (${[...allowed].join(', ')}).`);
    }
    overrides.set(key, column);
  }
  return overrides;
}

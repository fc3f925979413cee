import type { SimulatedRecording } from './simulate-recording.js';

export interface CsvOptions {
  /** Add the exact velocity columns `d<name>` (default false). */
  velocities?: boolean;
  /** Coordinates whose force column `u_<name>` is written (default: those with a non-zero force somewhere). */
  forces?: string[];
}

/** CSV text with a header row: `time`, the coordinates, optionally `d<name>`, then `u_<name>` force columns. */
export function recordingToCsv(recording: SimulatedRecording, names: string[], options: CsvOptions = {}): string {
  if (names.length !== recording.q.length) {
    throw new RangeError(`recordingToCsv: ${names.length} names for ${recording.q.length} coordinates`);
  }
  const forced = options.forces ?? names.filter((_, i) => recording.u[i].some((v) => v !== 0));
  const forceIndices = forced.map((name) => {
    const index = names.indexOf(name);
    if (index < 0) throw new RangeError(`recordingToCsv: no coordinate named ${name}`);
    return index;
  });
  const header = ['time', ...names];
  const columns: Float64Array[] = [recording.time, ...recording.q];
  if (options.velocities) {
    header.push(...names.map((name) => `d${name}`));
    columns.push(...recording.dq);
  }
  header.push(...forceIndices.map((i) => `u_${names[i]}`));
  columns.push(...forceIndices.map((i) => recording.u[i]));

  const lines = [header.join(',')];
  for (let k = 0; k < recording.time.length; k++) lines.push(columns.map((column) => String(column[k])).join(','));
  return lines.join('\n') + '\n';
}

import { recordingFromCsv } from '../../../shared/math/csv-recording.js';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import { samplingStatistics } from '../../../shared/math/sampling-statistics.js';
import { checkCoordinateNames } from '../../../shared/math/term-symbols.js';
import type { RecordingChannel, RecordingMapping, RecordingSampling } from '../../../shared/schemas/recording.js';
import type { ColumnMapping } from '../../../shared/schemas/sweep-description.js';
import { HttpError } from '../http/http-error.js';
import { uploadRefusal } from './upload-error.js';

/** Fewer samples than this cannot give derivatives or regression rows worth a sweep. */
export const minimumSampleCount = 10;

export interface ParsedRecording {
  channels: RecordingChannel[];
  /** One array per channel, in the order of `channels`; time first. */
  values: Float64Array[];
  sampleCount: number;
  startTime: number;
  durationSeconds: number;
  sampling: RecordingSampling;
  forced: boolean;
}

/** The mapping in the form the CSV reader takes. */
export function columnMappingOf(mapping: RecordingMapping): ColumnMapping {
  const columns: ColumnMapping = { time: mapping.time.column };
  const forces: Record<string, string> = {};
  for (const coordinate of mapping.coordinates) {
    columns[coordinate.name] = coordinate.column;
    if (coordinate.velocity) columns[`d${coordinate.name}`] = coordinate.velocity.column;
    if (coordinate.force) forces[coordinate.name] = coordinate.force.column;
  }
  if (Object.keys(forces).length > 0) columns.forces = forces;
  return columns;
}

/** The channels the mapping asks for, in storage order: time, then per coordinate position, velocity, force. */
export function channelsOf(mapping: RecordingMapping): RecordingChannel[] {
  const channels: RecordingChannel[] = [{ key: 'time', kind: 'time', coordinate: null, column: mapping.time.column, unit: mapping.time.unit }];
  for (const c of mapping.coordinates) {
    channels.push({ key: c.name, kind: 'position', coordinate: c.name, column: c.column, unit: c.unit });
    if (c.velocity) channels.push({ key: `d${c.name}`, kind: 'velocity', coordinate: c.name, column: c.velocity.column, unit: c.velocity.unit });
    if (c.force) channels.push({ key: `force:${c.name}`, kind: 'force', coordinate: c.name, column: c.force.column, unit: c.force.unit });
  }
  return channels;
}

/**
 * Reads an uploaded CSV with its mapping through the same reader the command line uses: every mapped cell
 * must be a number and time must increase. Refusals name line, data row and column (400 `invalid_body`).
 */
export function parseRecording(text: string, fileName: string, mapping: RecordingMapping): ParsedRecording {
  const names = mapping.coordinates.map((c) => c.name);
  try {
    checkCoordinateNames(names);
  } catch (error) {
    if (error instanceof DiscoveryInputError) throw new HttpError(400, 'invalid_body', error.message, { 'mapping.coordinates': error.message });
    throw error;
  }
  let recording;
  try {
    recording = recordingFromCsv(text, fileName, 'train', names, columnMappingOf(mapping));
  } catch (error) {
    if (error instanceof DiscoveryInputError) throw uploadRefusal(error);
    throw error;
  }
  const sampleCount = recording.time.length;
  if (sampleCount < minimumSampleCount) {
    const message = `${fileName} has ${sampleCount} samples; a recording needs at least ${minimumSampleCount}.`;
    throw new HttpError(400, 'invalid_body', `The recording was refused: ${message}`, { file: message });
  }
  const values: Float64Array[] = [recording.time];
  mapping.coordinates.forEach((c, i) => {
    values.push(recording.positions[i]!);
    if (c.velocity) values.push(recording.velocities[i]!);
    if (c.force) values.push(recording.forces![i]!);
  });
  const statistics = samplingStatistics([recording.time]);
  const own = statistics.perRecording[0]!;
  return {
    channels: channelsOf(mapping),
    values,
    sampleCount,
    startTime: recording.time[0]!,
    durationSeconds: recording.time[sampleCount - 1]! - recording.time[0]!,
    sampling: { steps: own.steps, sampleRate: statistics.sampleRate, uniform: own.uniform, gapCount: statistics.gapCount },
    forced: mapping.coordinates.some((c) => c.force !== undefined),
  };
}

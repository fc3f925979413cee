import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { recordingFromCsv } from '../../../shared/math/csv-recording.js';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import type { Recording } from '../../../shared/math/recording.js';
import { safeParsePlain } from '../../../shared/schemas/plain-issue-message.js';
import {
  describeSchemaIssues,
  sweepDescriptionSchema,
  type SweepDescription,
} from '../../../shared/schemas/sweep-description.js';

/** Reads and validates a sweep description file; every problem becomes a DiscoveryInputError. */
export async function readDescription(file: string): Promise<SweepDescription> {
  const text = await readText(file, 'sweep description');
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    throw new DiscoveryInputError(`${file} is not valid JSON: ${(error as Error).message}`);
  }
  const parsed = safeParsePlain(sweepDescriptionSchema, json);
  if (!parsed.success) {
    throw new DiscoveryInputError(`${file} is not a valid sweep description:\n${describeSchemaIssues(parsed.error)}`);
  }
  return parsed.data;
}

/** Reads the description's recordings, resolving file names against the folder of the description. */
export async function readRecordings(description: SweepDescription, descriptionFile: string): Promise<Recording[]> {
  const folder = path.dirname(path.resolve(descriptionFile));
  const recordings: Recording[] = [];
  for (const reference of description.recordings) {
    const text = await readText(path.resolve(folder, reference.file), 'recording');
    recordings.push(recordingFromCsv(text, reference.file, reference.role, description.coordinates, description.columns));
  }
  return recordings;
}

/** Reads a text file; a missing or unreadable file becomes a DiscoveryInputError naming it and what it is. */
export async function readText(file: string, what: string): Promise<string> {
  try {
    return await readFile(file, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder' : (error as Error).message;
    throw new DiscoveryInputError(`Cannot read the ${what} ${file}: ${reason}.`);
  }
}

import type { ColumnMapping, RecordingRole } from '../schemas/sweep-description.js';
import { DiscoveryInputError } from './discovery-input-error.js';
import type { Recording } from './recording.js';

/** A CSV file split into a header and rows of cells, with the file line of every row for messages. */
export interface CsvTable {
  header: string[];
  rows: string[][];
  lines: number[];
}

/**
 * Splits CSV text (comma separated, header row first, optional double quotes around cells, CRLF or LF line
 * ends, blank lines ignored) into cells. Throws DiscoveryInputError naming the file and line of a row whose
 * cell count differs from the header's.
 */
export function parseCsvTable(text: string, fileName: string): CsvTable {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  const headerLine = lines.findIndex((line) => line.trim() !== '');
  if (headerLine < 0) throw new DiscoveryInputError(`${fileName} is empty: it needs a header row and samples.`);
  const header = splitCsvLine(lines[headerLine]!);
  const rows: string[][] = [];
  const lineNumbers: number[] = [];
  for (let i = headerLine + 1; i < lines.length; i++) {
    if (lines[i]!.trim() === '') continue;
    const cells = splitCsvLine(lines[i]!);
    if (cells.length !== header.length) {
      throw new DiscoveryInputError(
        `${fileName}, line ${i + 1}: ${cells.length} cells, but the header row has ${header.length} columns.`,
      );
    }
    rows.push(cells);
    lineNumbers.push(i + 1);
  }
  return { header, rows, lines: lineNumbers };
}

function splitCsvLine(line: string): string[] {
  return line.split(',').map((cell) => cell.trim().replace(/^"(.*)"$/, '$1').trim());
}

const decimalNumber = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** The numbers of one named column; throws naming the file, line, data row and column of a bad cell. */
export function numericColumn(table: CsvTable, column: string, fileName: string): Float64Array {
  const index = table.header.indexOf(column);
  if (index < 0) {
    throw new DiscoveryInputError(
      `${fileName} has no column "${column}" (its columns: ${table.header.map((h) => `"${h}"`).join(', ')}).`,
    );
  }
  const values = new Float64Array(table.rows.length);
  table.rows.forEach((row, r) => {
    const cell = row[index]!;
    if (!decimalNumber.test(cell)) {
      throw new DiscoveryInputError(
        `${fileName}, line ${table.lines[r]} (data row ${r + 1}), column "${column}": ` +
          `${cell === '' ? 'the cell is empty' : `"${cell}" is not a number`}.`,
      );
    }
    values[r] = Number(cell);
  });
  return values;
}

/**
 * Reads one recording from CSV text with the description's column mapping: time, every coordinate, the
 * velocity columns given, and the force columns (coordinates without one get no force). Checks that time
 * increases strictly, naming the first row where it does not.
 */
export function recordingFromCsv(
  text: string,
  fileName: string,
  role: RecordingRole,
  coordinates: readonly string[],
  mapping: ColumnMapping,
): Recording {
  const table = parseCsvTable(text, fileName);
  if (table.rows.length === 0) throw new DiscoveryInputError(`${fileName} has a header row but no samples.`);
  const column = (name: string) => numericColumn(table, name, fileName);
  const time = column(mapping.time);
  for (let r = 1; r < time.length; r++) {
    if (!(time[r]! > time[r - 1]!)) {
      throw new DiscoveryInputError(
        `${fileName}, line ${table.lines[r]} (data row ${r + 1}), column "${mapping.time}": time ${time[r]} does not ` +
          `increase (the row before has ${time[r - 1]}); samples must be in strictly increasing time.`,
      );
    }
  }
  const mapped = (key: string) => (mapping[key] as string | undefined) ?? null;
  const forces = mapping.forces;
  return {
    name: fileName,
    role,
    time,
    positions: coordinates.map((c) => column(mapped(c)!)),
    velocities: coordinates.map((c) => {
      const name = mapped(`d${c}`);
      return name === null ? null : column(name);
    }),
    forces: forces === undefined ? null : coordinates.map((c) => (forces[c] === undefined ? null : column(forces[c]!))),
  };
}

import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import { HttpError } from '../http/http-error.js';

const cellFault = /line (\d+) \(data row (\d+)\), column "([^"]*)"/;
const rowFault = /line (\d+):/;
const missingColumn = /has no column "([^"]*)"/;

/**
 * Turns a refusal of the CSV reader into 400 `invalid_body`. The message stays the reader's (it names line,
 * data row and column); `fields` repeats them for forms: `file`, and `line`, `row`, `column` when known.
 */
export function uploadRefusal(error: DiscoveryInputError): HttpError {
  const fields: Record<string, string> = { file: error.message };
  const cell = cellFault.exec(error.message);
  if (cell) Object.assign(fields, { line: cell[1]!, row: cell[2]!, column: cell[3]! });
  else {
    const row = rowFault.exec(error.message);
    if (row) fields.line = row[1]!;
    const column = missingColumn.exec(error.message);
    if (column) fields.column = column[1]!;
  }
  return new HttpError(400, 'invalid_body', `The recording was refused: ${error.message}`, fields);
}

/** Decodes an uploaded file as UTF-8 text, refusing binary files with a plain message. */
export function uploadedText(buffer: Buffer, fileName: string): string {
  try {
    const text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
    if (text.includes('\u0000')) throw new TypeError('NUL byte');
    return text;
  } catch {
    throw new HttpError(400, 'invalid_body', `${fileName} is not a text (UTF-8) CSV file.`, { file: 'Not a text CSV file.' });
  }
}

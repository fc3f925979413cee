import { parseCsvTable } from '../../../shared/math/csv-recording.js';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import type { RecordingInspection } from '../../../shared/schemas/recording.js';
import { uploadRefusal } from './upload-error.js';

const previewRowCount = 8;
const decimalNumber = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const timeLikeName = /^(t|time|timestamp|t_s|time_s|t\[s\]|time\[s\]|seconds|sec|s)$/i;

/** What an uploaded CSV holds, for the mapping step: header, a preview, the numeric columns, a likely time column. */
export function inspectCsv(text: string, fileName: string, sizeBytes: number): RecordingInspection {
  let table;
  try {
    table = parseCsvTable(text, fileName);
  } catch (error) {
    if (error instanceof DiscoveryInputError) throw uploadRefusal(error);
    throw error;
  }
  const numeric = table.header.filter((_, c) => table.rows.length > 0 && table.rows.every((row) => decimalNumber.test(row[c]!)));
  const increasing = (column: string) => {
    const c = table.header.indexOf(column);
    return table.rows.every((row, r) => r === 0 || Number(row[c]) > Number(table.rows[r - 1]![c]));
  };
  const suggestedTimeColumn = numeric.find((column) => timeLikeName.test(column) && increasing(column)) ?? null;
  return {
    fileName,
    sizeBytes,
    header: table.header,
    rowCount: table.rows.length,
    previewRows: table.rows.slice(0, previewRowCount),
    numericColumns: numeric,
    suggestedTimeColumn,
  };
}

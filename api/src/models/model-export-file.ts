import { exportC } from '../../../shared/model/export-c.js';
import { exportLatex } from '../../../shared/model/export-latex.js';
import { exportPython } from '../../../shared/model/export-python.js';
import { exportReport } from '../../../shared/model/export-report.js';
import { exportTypeScript } from '../../../shared/model/export-typescript.js';
import { serializeModelDocument } from '../../../shared/model/model-document.js';
import type { ModelDetails } from '../../../shared/schemas/model-details.js';
import type { ModelExportFormat } from '../../../shared/schemas/model-request.js';

interface ExportKind {
  extension: string;
  contentType: string;
  /** The file's text; every export carries the safety caution (the shared/model export functions add it). */
  write(details: ModelDetails): string;
}

const exportKinds: Record<ModelExportFormat, ExportKind> = {
  latex: { extension: 'tex', contentType: 'application/x-tex; charset=utf-8', write: (d) => exportLatex(d.document) },
  c: { extension: 'c', contentType: 'text/x-csrc; charset=utf-8', write: (d) => exportC(d.document) },
  typescript: { extension: 'ts', contentType: 'text/x-typescript; charset=utf-8', write: (d) => exportTypeScript(d.document) },
  python: { extension: 'py', contentType: 'text/x-python; charset=utf-8', write: (d) => exportPython(d.document) },
  json: { extension: 'json', contentType: 'application/json; charset=utf-8', write: (d) => serializeModelDocument(d.document) },
  report: { extension: 'html', contentType: 'text/html; charset=utf-8', write: (d) => exportReport(d) },
};

export interface ModelExportFile {
  fileName: string;
  contentType: string;
  text: string;
}

/** Names a download `<project>-<first 8 characters of the sweep id>-model-<n>.<ext>`, n counted from 1 as on screen. */
export function modelExportFileName(projectName: string, sweepId: string, modelIndex: number, extension: string): string {
  const project =
    projectName
      .normalize('NFKD')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60)
      .replace(/-+$/, '') || 'project';
  return `${project}-${sweepId.slice(0, 8)}-model-${modelIndex + 1}.${extension}`;
}

/** One model as a file in the given format, with its name and content type. */
export function modelExportFile(
  details: ModelDetails,
  format: ModelExportFormat,
  names: { projectName: string; sweepId: string; modelIndex: number },
): ModelExportFile {
  const kind = exportKinds[format];
  return {
    fileName: modelExportFileName(names.projectName, names.sweepId, names.modelIndex, kind.extension),
    contentType: kind.contentType,
    text: kind.write(details),
  };
}

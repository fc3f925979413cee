import { expect } from 'chai';
import { execFile } from 'node:child_process';
import { rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';
import { exportC } from '../../shared/model/export-c.js';
import { exportLatex } from '../../shared/model/export-latex.js';
import { exportPython } from '../../shared/model/export-python.js';
import { exportReport } from '../../shared/model/export-report.js';
import { exportTypeScript } from '../../shared/model/export-typescript.js';
import { parseModelDocument, serializeModelDocument } from '../../shared/model/model-document.js';
import { safetyCaution } from '../../shared/model/safety-caution.js';
import { apiErrorSchema } from '../../shared/schemas/api-error.js';
import { modelDetailsSchema, type ModelDetails } from '../../shared/schemas/model-details.js';
import { modelExportFormats, type ModelExportFormat } from '../../shared/schemas/model-request.js';
import { createTeamWithUsers, signIn } from '../support/fixtures.js';
import { runModelSweep, type ModelSweep } from '../support/model-sweep.js';
import { generousAllowance, startTestApp, type TestApp } from '../support/test-app.js';

/** What each download must be: extension, content type, and the pure export function it must equal. */
const expectedFiles: Record<ModelExportFormat, { extension: string; contentType: string; text: (d: ModelDetails) => string }> = {
  latex: { extension: 'tex', contentType: 'application/x-tex; charset=utf-8', text: (d) => exportLatex(d.document) },
  c: { extension: 'c', contentType: 'text/x-csrc; charset=utf-8', text: (d) => exportC(d.document) },
  typescript: { extension: 'ts', contentType: 'text/x-typescript; charset=utf-8', text: (d) => exportTypeScript(d.document) },
  python: { extension: 'py', contentType: 'text/x-python; charset=utf-8', text: (d) => exportPython(d.document) },
  json: { extension: 'json', contentType: 'application/json; charset=utf-8', text: (d) => serializeModelDocument(d.document) },
  report: { extension: 'html', contentType: 'text/html; charset=utf-8', text: (d) => exportReport(d) },
};

/** The text with comment markers at line starts removed and white space folded, so a wrapped caution reads as one line. */
function prose(text: string): string {
  return text
    .split('\n')
    .map((line) => line.replace(/^\s*(\/\/|\/?\*|#|%)\s?/, ''))
    .join(' ')
    .replace(/\s+/g, ' ');
}

describe('model exports (GET /api/sweeps/:sweepId/models/:modelIndex/exports/:format)', () => {
  let app: TestApp;
  let run: ModelSweep;
  let details: ModelDetails;
  const projectName = 'Cart-pole export rig';
  const exportUrl = (format: string, index = 0) => `/api/sweeps/${run.sweep.id}/models/${index}/exports/${format}`;

  before(async function () {
    this.timeout(240_000);
    app = await startTestApp({ allowanceDefaults: generousAllowance });
    run = await runModelSweep(app, 'Model exports lab', projectName);
    const response = await run.analyst.get(`/api/sweeps/${run.sweep.id}/models/0`);
    expect(response.status, await response.clone().text()).to.equal(200);
    // The exports are worked out from the details as stored (key order included), not as a schema re-builds them.
    details = (await response.json()) as ModelDetails;
    modelDetailsSchema.parse(details);
  });
  after(async () => {
    await app?.close();
    if (run) rmSync(run.folder, { recursive: true, force: true });
  });

  for (const format of modelExportFormats) {
    it(`serves ${format} as a named attachment with the caution, equal to the export function's text`, async () => {
      const expected = expectedFiles[format];
      const response = await run.analyst.get(exportUrl(format));
      expect(response.status, await response.clone().text()).to.equal(200);
      expect(response.headers.get('content-type')).to.equal(expected.contentType);
      expect(response.headers.get('content-disposition')).to.equal(
        `attachment; filename="cart-pole-export-rig-${run.sweep.id.slice(0, 8)}-model-1.${expected.extension}"`,
      );
      const text = await response.text();
      expect(text).to.equal(expected.text(details));
      expect(prose(text)).to.contain(safetyCaution);
    });
  }

  it('names a later model by its place counted from 1, as the screens do', async () => {
    const response = await run.analyst.get(exportUrl('python', 1));
    expect(response.status).to.equal(200);
    expect(response.headers.get('content-disposition')).to.equal(`attachment; filename="cart-pole-export-rig-${run.sweep.id.slice(0, 8)}-model-2.py"`);
  });

  it('serves a model document that reads back as the model of the details', async () => {
    const text = await (await run.analyst.get(exportUrl('json'))).text();
    expect(parseModelDocument(text, 'model.json')).to.deep.equal(details.document);
    // Kept as written: the format and its version lead, as README's model document section lists them.
    expect(text).to.match(/^\{\n {2}"format": "conserva-model",\n {2}"version": 1,\n {2}"title": /);
  });

  it('serves C that compiles with cc -std=c99 -Wall -Wextra -pedantic -Werror', async function () {
    this.timeout(60_000);
    const source = path.join(run.folder, 'model.c');
    writeFileSync(source, await (await run.analyst.get(exportUrl('c'))).text());
    await promisify(execFile)('cc', ['-std=c99', '-Wall', '-Wextra', '-pedantic', '-Werror', '-c', source, '-o', path.join(run.folder, 'model.o')]);
  });

  it('answers 400 naming the formats for an unknown one', async () => {
    const response = await run.analyst.get(exportUrl('pdf'));
    expect(response.status).to.equal(400);
    const { error } = apiErrorSchema.parse(await response.json());
    expect(error.code).to.equal('bad_request');
    for (const format of modelExportFormats) expect(error.message).to.contain(format);
    expect(error.fields).to.have.property('format');
  });

  it('lets viewers of the team download and answers 404 to another team', async () => {
    const viewer = await signIn(app.baseUrl, run.team.viewer.email, run.team.password);
    const served = await viewer.get(exportUrl('latex'));
    expect(served.status).to.equal(200);
    expect(await served.text()).to.equal(exportLatex(details.document));
    const other = await createTeamWithUsers(app.orm, 'Export bystanders');
    const outsider = await signIn(app.baseUrl, other.analyst.email, other.password);
    for (const format of ['latex', 'report']) expect((await outsider.get(exportUrl(format))).status, format).to.equal(404);
  });
});

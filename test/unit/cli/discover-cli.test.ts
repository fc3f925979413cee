import { expect } from 'chai';
import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { discoveryResultSchema } from '../../../shared/schemas/discovery-result.js';
import { pendulumTorque, forcesOf } from '../../support/mechanisms/forcing.js';
import { simplePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { recordingToCsv, simulateRecording } from '../../support/mechanisms/simulate-recording.js';

const root = path.resolve(import.meta.dirname, '../../..');

interface Run {
  status: number;
  stdout: string;
  stderr: string;
}

/** Runs the command line as scripts outside the project do (through tsx, as the npm script does). */
function conserva(args: string[]): Promise<Run> {
  return new Promise((resolve) => {
    execFile(
      process.execPath,
      ['--import', 'tsx', path.join(root, 'worker/src/cli/main.ts'), ...args],
      { cwd: root, encoding: 'utf8', timeout: 60_000 },
      (error, stdout, stderr) => resolve({ status: error ? Number(error.code ?? 1) : 0, stdout, stderr }),
    );
  });
}

/** A forced pendulum description over one CSV; `change` edits the description, `csv` replaces the data. */
function writeCase(dir: string, change: (d: Record<string, unknown>) => void = () => {}, csv?: string): string {
  const description: Record<string, unknown> = {
    coordinates: ['th'],
    recordings: [{ file: 'run.csv', role: 'train' }],
    columns: { time: 't', th: 'angle', forces: { th: 'torque' } },
    terms: ['cos(th)', 'sin(th)', 'th^2', 'dth^2*cos(th)'],
    known: ['dth^2'],
    sizes: { min: 0, max: 2 },
    form: 'balance',
    derivatives: { method: 'central' },
    balance: { window: 4, stride: 2 },
  };
  change(description);
  writeFileSync(path.join(dir, 'run.csv'), csv ?? smallCsv(40));
  const file = path.join(dir, 'description.json');
  writeFileSync(file, JSON.stringify(description));
  return file;
}

/** A short swing of cos-shaped angle and a sine torque: only its shape matters for the refusals. */
function smallCsv(rows: number): string {
  const lines = ['t,angle,torque'];
  for (let k = 0; k < rows; k++) lines.push(`${k * 0.01},${0.3 * Math.cos(3 * k * 0.01)},${0.1 * Math.sin(2 * k * 0.01)}`);
  return `${lines.join('\n')}\n`;
}

describe('conserva discover (command line)', function () {
  this.timeout(60_000);
  let dir: string;
  beforeEach(() => {
    dir = mkdtempSync(path.join(tmpdir(), 'conserva-cli-'));
  });
  afterEach(() => rmSync(dir, { recursive: true, force: true }));

  async function expectRefusal(file: string, ...fragments: string[]): Promise<void> {
    const run = await conserva(['discover', file, '--json']);
    expect(run.status, run.stderr).to.equal(2);
    expect(run.stdout).to.equal('');
    for (const fragment of fragments) expect(run.stderr).to.contain(fragment);
  }

  it('refuses a missing column, naming the file and the column', async () => {
    await expectRefusal(writeCase(dir, (d) => ((d['columns'] as Record<string, unknown>)['th'] = 'angle_rad')), 'run.csv', 'no column "angle_rad"');
  });

  it('refuses a non-numeric cell, naming its row and column', async () => {
    const csv = smallCsv(40).replace(/\n0\.05,[^,]*,/, '\n0.05,n/a,');
    await expectRefusal(writeCase(dir, undefined, csv), 'run.csv, line 7 (data row 6), column "angle"', '"n/a" is not a number');
  });

  it('refuses time that does not increase, naming the row', async () => {
    const csv = smallCsv(40).replace('\n0.03,', '\n0.01,');
    await expectRefusal(writeCase(dir, undefined, csv), 'line 5 (data row 4), column "t"', 'does not increase');
  });

  it('refuses a recording too short for the derivative window', async () => {
    await expectRefusal(
      writeCase(dir, (d) => (d['derivatives'] = { method: 'savitzky-golay', window: 31, order: 3 }), smallCsv(25)),
      'run.csv has 25 samples',
      'window 31',
    );
  });

  it('refuses a recording too short for the balance window', async () => {
    await expectRefusal(writeCase(dir, (d) => (d['balance'] = { window: 60, stride: 5 })), 'run.csv', 'too few for a balance window of 60');
  });

  it('refuses an unknown symbol in a term, naming the term', async () => {
    await expectRefusal(writeCase(dir, (d) => (d['terms'] = ['cos(th)', 'dth*dx'])), 'Term "dth*dx"', 'unknown symbol "dx"');
  });

  it('refuses passive data without a reference term', async () => {
    const columns = { time: 't', th: 'angle' };
    await expectRefusal(writeCase(dir, (d) => (d['columns'] = columns)), 'carry no forces', 'reference');
  });

  it('refuses a term that is a constant', async () => {
    await expectRefusal(writeCase(dir, (d) => (d['terms'] = ['cos(th)', 'sin(th)^2 + cos(th)^2'])), 'Term "sin(th)^2 + cos(th)^2"', 'constant');
  });

  it('refuses an invalid description, naming the field', async () => {
    await expectRefusal(writeCase(dir, (d) => (d['form'] = 'integral')), 'form');
    await expectRefusal(writeCase(dir, (d) => delete d['sizes']), 'sizes');
  });

  it('refuses a missing description file and malformed JSON', async () => {
    await expectRefusal(path.join(dir, 'nowhere.json'), 'no such file');
    const file = path.join(dir, 'broken.json');
    writeFileSync(file, '{"coordinates": [');
    await expectRefusal(file, 'not valid JSON');
  });

  describe('on a forced pendulum simulated from its handbook equations (Landau & Lifshitz, Mechanics, sec. 5)', () => {
    function writePendulum(): string {
      const run = (q0: number, duration: number) =>
        simulateRecording(simplePendulum, {
          initial: { q: [q0], dq: [0] },
          duration,
          sampleStep: 0.01,
          forces: forcesOf(pendulumTorque),
        });
      writeFileSync(path.join(dir, 'swing.csv'), recordingToCsv(run(0.4, 4), ['th']));
      writeFileSync(path.join(dir, 'check.csv'), recordingToCsv(run(-0.9, 3), ['th']));
      const file = path.join(dir, 'pendulum.json');
      writeFileSync(
        file,
        JSON.stringify({
          coordinates: ['th'],
          recordings: [
            { file: 'swing.csv', role: 'train' },
            { file: 'check.csv', role: 'validate' },
          ],
          columns: { time: 'time', th: 'th', forces: { th: 'u_th' } },
          generate: {},
          sizes: { min: 1, max: 3 },
          form: 'balance',
          derivatives: { method: 'savitzky-golay', window: 9, order: 6 },
          top: 4,
        }),
      );
      return file;
    }

    it('prints one JSON object of the documented shape whose best energy is the handbook one', async () => {
      const run = await conserva(['discover', writePendulum(), '--json']);
      expect(run.status, run.stderr).to.equal(0);
      expect(run.stderr).to.contain('sweep:');
      const result = discoveryResultSchema.parse(JSON.parse(run.stdout));
      // Generated set for one coordinate: 8 terms; subsets of sizes 1..3: 8 + 28 + 56.
      expect(result.evaluated + result.rejected).to.equal(92);
      expect(result.rankedBy).to.equal('validation');
      expect(result.models).to.have.length(4);
      expect(result.models[0]!.validationRmse).to.be.a('number');
      const { m, l, g } = simplePendulum.parameters as { m: number; l: number; g: number };
      const best = result.best!;
      expect([...best.terms].sort()).to.deep.equal(['cos(th)', 'dth^2']);
      // E = m l^2/2 dth^2 - m g l cos th; L flips the potential term (Landau & Lifshitz, Mechanics, sec. 5).
      expect(best.coefficients[best.terms.indexOf('dth^2')]! / ((m * l * l) / 2) - 1).to.be.closeTo(0, 1e-3);
      expect(best.coefficients[best.terms.indexOf('cos(th)')]! / (-m * g * l) - 1).to.be.closeTo(0, 1e-3);
      expect(best.lagrangian).to.match(/^[0-9.e-]+\*dth\^2 \+ [0-9.e-]+\*cos\(th\)$|^[0-9.e-]+\*cos\(th\) \+ [0-9.e-]+\*dth\^2$/);
      expect(best.energy).to.contain(String(best.coefficients[0]!).replace('-', ''));
      expect(result.signals.description).to.equal('Savitzky-Golay estimator (window 9, order 6)');
      expect(result.caution).to.contain('Validate it on the real machine');
    });

    it('prints a readable table without --json', async () => {
      const run = await conserva(['discover', writePendulum()]);
      expect(run.status, run.stderr).to.equal(0);
      expect(run.stdout).to.contain('train rmse').and.to.contain('Best energy:').and.to.contain('Caution:');
      expect(() => JSON.parse(run.stdout)).to.throw();
    });
  });

  it('prints usage with --help and exits 0', async () => {
    const run = await conserva(['--help']);
    expect(run.status).to.equal(0);
    expect(run.stdout).to.contain('conserva discover <description.json> [--json]');
  });
});

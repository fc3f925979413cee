import { expect } from 'chai';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { discoveryResultSchema } from '../../../shared/schemas/discovery-result.js';
import { pendulumTorque, forcesOf } from '../../support/mechanisms/forcing.js';
import { simplePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { recordingToCsv, simulateRecording } from '../../support/mechanisms/simulate-recording.js';
import { runConserva, type CliRun } from '../../support/run-cli.js';

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

  describe('refusals (exit 2, a clear message on standard error, nothing on standard output)', () => {
    /** Each case writes its files into its own folder and names the description to run. */
    const refusals: { title: string; prepare: (folder: string) => string; fragments: string[] }[] = [
      {
        title: 'a missing column, naming the file and the column',
        prepare: (f) => writeCase(f, (d) => ((d['columns'] as Record<string, unknown>)['th'] = 'angle_rad')),
        fragments: ['run.csv', 'no column "angle_rad"'],
      },
      {
        title: 'a non-numeric cell, naming its row and column',
        prepare: (f) => writeCase(f, undefined, smallCsv(40).replace(/\n0\.05,[^,]*,/, '\n0.05,n/a,')),
        fragments: ['run.csv, line 7 (data row 6), column "angle"', '"n/a" is not a number'],
      },
      {
        title: 'time that does not increase, naming the row',
        prepare: (f) => writeCase(f, undefined, smallCsv(40).replace('\n0.03,', '\n0.01,')),
        fragments: ['line 5 (data row 4), column "t"', 'does not increase'],
      },
      {
        title: 'a recording too short for the derivative window',
        prepare: (f) => writeCase(f, (d) => (d['derivatives'] = { method: 'savitzky-golay', window: 31, order: 3 }), smallCsv(25)),
        fragments: ['run.csv has 25 samples', 'window 31'],
      },
      {
        title: 'a recording too short for the balance window',
        prepare: (f) => writeCase(f, (d) => (d['balance'] = { window: 60, stride: 5 })),
        fragments: ['run.csv', 'too few for a balance window of 60'],
      },
      {
        title: 'an unknown symbol in a term, naming the term',
        prepare: (f) => writeCase(f, (d) => (d['terms'] = ['cos(th)', 'dth*dx'])),
        fragments: ['Term "dth*dx"', 'unknown symbol "dx"'],
      },
      {
        title: 'passive data without a reference term',
        prepare: (f) => writeCase(f, (d) => (d['columns'] = { time: 't', th: 'angle' })),
        fragments: ['carry no forces', 'reference'],
      },
      {
        title: 'a term that is a constant',
        prepare: (f) => writeCase(f, (d) => (d['terms'] = ['cos(th)', 'sin(th)^2 + cos(th)^2'])),
        fragments: ['Term "sin(th)^2 + cos(th)^2"', 'constant'],
      },
      {
        title: 'an invalid field value, naming the field',
        prepare: (f) => writeCase(f, (d) => (d['form'] = 'integral')),
        fragments: ['form: The form is "balance" or "derivative".'],
      },
      {
        title: 'a size beyond the limit, in a plain sentence',
        prepare: (f) => writeCase(f, (d) => (d['sizes'] = { min: 0, max: 13 })),
        fragments: ['is not a valid sweep description', 'sizes.max: At most 12 extra terms per model.'],
      },
      {
        title: 'a misspelt field, naming it',
        prepare: (f) => writeCase(f, (d) => (d['szes'] = { max: 2 })),
        fragments: ['"szes" is not a field here: check its spelling, or leave it out.'],
      },
      {
        title: 'a missing field, naming it',
        prepare: (f) => writeCase(f, (d) => delete d['sizes']),
        fragments: ['sizes: This field is required.'],
      },
      { title: 'a missing description file', prepare: (f) => path.join(f, 'nowhere.json'), fragments: ['no such file'] },
      {
        title: 'malformed JSON',
        prepare: (f) => {
          writeFileSync(path.join(f, 'broken.json'), '{"coordinates": [');
          return path.join(f, 'broken.json');
        },
        fragments: ['not valid JSON'],
      },
    ];
    const results = new Map<string, CliRun>();
    let folder: string;

    // The runs are independent processes: start them a few at a time so the file takes less wall time.
    before(async () => {
      folder = mkdtempSync(path.join(tmpdir(), 'conserva-cli-refusals-'));
      const queue = refusals.map((refusal, k) => {
        const own = path.join(folder, String(k));
        mkdirSync(own);
        return { title: refusal.title, file: refusal.prepare(own) };
      });
      const worker = async () => {
        for (let next = queue.shift(); next; next = queue.shift()) {
          results.set(next.title, await runConserva(['discover', next.file, '--json']));
        }
      };
      await Promise.all([worker(), worker(), worker()]);
    });
    after(() => rmSync(folder, { recursive: true, force: true }));

    for (const refusal of refusals) {
      it(`refuses ${refusal.title}`, () => {
        const run = results.get(refusal.title)!;
        expect(run.status, run.stderr).to.equal(2);
        expect(run.stdout).to.equal('');
        for (const fragment of refusal.fragments) expect(run.stderr).to.contain(fragment);
      });
    }
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
      const run = await runConserva(['discover', writePendulum(), '--json']);
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
      const run = await runConserva(['discover', writePendulum()]);
      expect(run.status, run.stderr).to.equal(0);
      expect(run.stdout).to.contain('train rmse').and.to.contain('Best energy:').and.to.contain('Caution:');
      expect(() => JSON.parse(run.stdout)).to.throw();
    });
  });

  it('prints usage with --help and exits 0', async () => {
    const run = await runConserva(['--help']);
    expect(run.status).to.equal(0);
    expect(run.stdout).to.contain('conserva discover <description.json> [--json]');
  });
});

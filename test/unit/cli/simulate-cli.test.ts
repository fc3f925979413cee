import { expect } from 'chai';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { parseModelDocument, serializeModelDocument } from '../../../shared/model/model-document.js';
import { simulationResultSchema } from '../../../shared/schemas/simulation-result.js';
import { forcesOf, pendulumTorque } from '../../support/mechanisms/forcing.js';
import { simplePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { recordingToCsv, simulateRecording } from '../../support/mechanisms/simulate-recording.js';
import { runConserva, type CliRun } from '../../support/run-cli.js';
import { handbookModelDocument } from '../model/handbook-model.js';

// The model is the handbook pendulum (Landau & Lifshitz, Mechanics, sec. 5, problem 1 with m2 = 0); the
// recordings are simulated from its hand-written equation of motion with our parameters.
const handbookModel = serializeModelDocument(handbookModelDocument(simplePendulum, 'handbook pendulum'));

function forcedSwing(q0: number, duration: number): string {
  const run = simulateRecording(simplePendulum, { initial: { q: [q0], dq: [0] }, duration, sampleStep: 0.01, forces: forcesOf(pendulumTorque) });
  return recordingToCsv(run, ['th']);
}

describe('conserva simulate (command line)', function () {
  this.timeout(120_000);
  let dir: string;
  before(() => {
    dir = mkdtempSync(path.join(tmpdir(), 'conserva-simulate-'));
    writeFileSync(path.join(dir, 'model.json'), handbookModel);
    writeFileSync(path.join(dir, 'swing.csv'), forcedSwing(-0.9, 3));
    writeFileSync(path.join(dir, 'renamed.csv'), forcedSwing(-0.9, 3).replace('time,th,u_th', 't,angle,torque'));
    writeFileSync(path.join(dir, 'train.csv'), forcedSwing(0.4, 4));
    writeFileSync(
      path.join(dir, 'description.json'),
      JSON.stringify({
        coordinates: ['th'],
        recordings: [{ file: 'train.csv', role: 'train' }],
        columns: { time: 'time', th: 'th', forces: { th: 'u_th' } },
        generate: {},
        sizes: { min: 1, max: 3 },
        derivatives: { method: 'savitzky-golay', window: 9, order: 6 },
      }),
    );
  });
  after(() => rmSync(dir, { recursive: true, force: true }));
  const file = (name: string) => path.join(dir, name);

  it('prints one JSON object of the documented shape: the handbook model follows its own recording', async () => {
    const run = await runConserva(['simulate', file('model.json'), file('swing.csv'), '--json', '--threshold', '0.001']);
    expect(run.status, run.stderr).to.equal(0);
    const result = simulationResultSchema.parse(JSON.parse(run.stdout));
    expect(result.columns).to.deep.equal({ time: 'time', th: 'th', u_th: 'u_th' });
    expect(result.figures.status).to.equal('finished');
    expect(result.figures.passive).to.equal(false);
    expect(result.figures.errors[0]!.max).to.be.below(1e-5);
    expect(result.figures.timeToThreshold).to.equal(null);
    expect(result.settings.threshold).to.equal(0.001);
    // Savitzky-Golay (window 9) estimates the initial velocity: the simulation starts at the fifth sample.
    expect(result.trajectory.time[0]).to.be.closeTo(0.04, 1e-12);
    expect(result.trajectory.time).to.have.length(297);
    expect(result.massMatrix.notPositiveDefinite).to.equal(0);
    expect(result.caution).to.contain('Validate it on the real machine');
  });

  it('maps other column names with --columns and thins the trajectory with --points', async () => {
    const run = await runConserva(['simulate', file('model.json'), file('renamed.csv'), '--json', '--columns', 'time=t,th=angle,u_th=torque', '--points', '50']);
    expect(run.status, run.stderr).to.equal(0);
    const result = simulationResultSchema.parse(JSON.parse(run.stdout));
    expect(result.columns).to.deep.equal({ time: 't', th: 'angle', u_th: 'torque' });
    // At most 50 samples, every k-th with the smallest k that keeps them to 50 with the last sample added:
    // 297 samples give k = 7, so 43 samples plus the last (k = 6 would give 50 plus the last).
    expect(result.trajectory.time).to.have.length(44);
    expect(result.trajectory.time[result.trajectory.time.length - 1]).to.equal(3);
    expect(result.figures.errors[0]!.max).to.be.below(1e-5);
  });

  it('treats a recording without force columns as passive (zero forces) and reports the energy drift', async () => {
    const passive = recordingToCsv(simulateRecording(simplePendulum, { initial: { q: [1.2], dq: [0] }, duration: 3, sampleStep: 0.01 }), ['th']);
    writeFileSync(file('passive.csv'), passive);
    const run = await runConserva(['simulate', file('model.json'), file('passive.csv'), '--json']);
    expect(run.status, run.stderr).to.equal(0);
    const result = simulationResultSchema.parse(JSON.parse(run.stdout));
    expect(result.figures.passive).to.equal(true);
    // Physics: a passive pendulum conserves E; the drift is the integrator's and the initial estimate's.
    expect(result.figures.energyDrift!.relative).to.be.below(1e-7);
  });

  it('prints a readable summary without --json', async () => {
    const run = await runConserva(['simulate', file('model.json'), file('swing.csv')]);
    expect(run.status, run.stderr).to.equal(0);
    expect(run.stdout).to.contain('error rms').and.to.contain('Mass matrix positive definite').and.to.contain('Caution:');
    expect(() => JSON.parse(run.stdout)).to.throw();
  });

  it('runs after discover --model-out: the discovered pendulum predicts a held-out swing', async () => {
    const discovered = await runConserva(['discover', file('description.json'), '--json', '--model-out', file('discovered.json')]);
    expect(discovered.status, discovered.stderr).to.equal(0);
    expect(JSON.parse(discovered.stdout)).to.have.property('best');
    const document = parseModelDocument(readFileSync(file('discovered.json'), 'utf8'), 'discovered.json');
    expect(document.provenance.source).to.equal('conserva discover');
    expect(document.provenance.recordings).to.deep.equal([{ name: 'train.csv', role: 'train' }]);
    expect([...document.lagrangian.terms.map((t) => t.term)].sort()).to.deep.equal(['cos(th)', 'dth^2']);
    const run = await runConserva(['simulate', file('discovered.json'), file('swing.csv'), '--json']);
    expect(run.status, run.stderr).to.equal(0);
    expect(simulationResultSchema.parse(JSON.parse(run.stdout)).figures.errors[0]!.rms).to.be.below(1e-4);
  });

  describe('refusals (exit 2, a clear message on standard error, nothing on standard output)', () => {
    const cases: { title: string; args: () => string[]; fragments: string[] }[] = [
      { title: 'a missing model file', args: () => ['simulate', file('nowhere.json'), file('swing.csv')], fragments: ['Cannot read the model document', 'no such file'] },
      { title: 'a missing recording', args: () => ['simulate', file('model.json'), file('nowhere.csv')], fragments: ['Cannot read the recording', 'no such file'] },
      { title: 'a file that is not a model document', args: () => ['simulate', file('description.json'), file('swing.csv')], fragments: ['description.json is not a Conserva model document'] },
      { title: 'a recording without the coordinate column, suggesting --columns', args: () => ['simulate', file('model.json'), file('renamed.csv')], fragments: ['renamed.csv has no column "time"', '--columns time=<column>'] },
      { title: 'a mapped column that does not exist', args: () => ['simulate', file('model.json'), file('renamed.csv'), '--columns', 'time=t,th=theta'], fragments: ['no column "theta"', 'mapped to th'] },
      { title: 'a --columns key that is not a symbol of the model', args: () => ['simulate', file('model.json'), file('swing.csv'), '--columns', 'x=angle'], fragments: ['--columns: "x"'] },
      { title: 'a threshold that is not positive', args: () => ['simulate', file('model.json'), file('swing.csv'), '--threshold', '-1'], fragments: ['--threshold must be a positive number'] },
      { title: 'an unknown force reading', args: () => ['simulate', file('model.json'), file('swing.csv'), '--forces', 'spline'], fragments: ['--forces must be cubic, linear or hold'] },
      { title: 'an option without its value', args: () => ['simulate', file('model.json'), file('swing.csv'), '--threshold'], fragments: ['--threshold needs a value'] },
      { title: 'an unknown option', args: () => ['simulate', file('model.json'), file('swing.csv'), '--fast'], fragments: ['Unknown option --fast'] },
      { title: 'a missing recording argument', args: () => ['simulate', file('model.json')], fragments: ['simulate takes a model document and one recording'] },
      {
        title: 'a model written to a folder that does not exist',
        args: () => ['discover', file('description.json'), '--model-out', file('no/such/folder/model.json')],
        fragments: ['Cannot write the model to'],
      },
    ];
    const results = new Map<string, CliRun>();
    before(async () => {
      const queue = [...cases];
      const worker = async () => {
        for (let next = queue.shift(); next; next = queue.shift()) results.set(next.title, await runConserva(next.args()));
      };
      await Promise.all([worker(), worker(), worker()]);
    });
    for (const c of cases) {
      it(`refuses ${c.title}`, () => {
        const run = results.get(c.title)!;
        expect(run.status, run.stderr).to.equal(2);
        if (c.args()[0] === 'simulate') expect(run.stdout).to.equal('');
        for (const fragment of c.fragments) expect(run.stderr).to.contain(fragment);
      });
    }
  });
});

import { expect } from 'chai';
import type { Recording } from '../../../shared/math/recording.js';
import { exportReport } from '../../../shared/model/export-report.js';
import { workOutModelDetails } from '../../../shared/model/model-details.js';
import { buildModelDocument } from '../../../shared/model/model-document.js';
import { safetyCaution } from '../../../shared/model/safety-caution.js';
import { niceTicks } from '../../../shared/model/svg-line-chart.js';
import { modelDetailsSchema } from '../../../shared/schemas/model-details.js';
import type { ModelDocument } from '../../../shared/schemas/model-document.js';
import { doublePendulumTorques, forcesOf } from '../../support/mechanisms/forcing.js';
import { doublePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { simulateRecording } from '../../support/mechanisms/simulate-recording.js';

// The model is the handbook double pendulum (Landau & Lifshitz, Mechanics, sec. 5, problem 1); the recordings
// are simulated from its hand-written equations with our parameters, so its simulation must follow them.
const document: ModelDocument = buildModelDocument({
  coordinates: doublePendulum.coordinates,
  energy: { terms: Object.keys(doublePendulum.energyTerms), coefficients: Object.values(doublePendulum.energyTerms) },
  lagrangian: { terms: Object.keys(doublePendulum.lagrangianTerms), coefficients: Object.values(doublePendulum.lagrangianTerms) },
  provenance: {
    source: 'model details test',
    form: 'balance',
    estimator: { method: 'savitzky-golay', window: 9, order: 6 },
    recordings: [],
    sweep: null,
    scores: null,
  },
  title: 'double pendulum <handbook>',
});

function recording(name: string, role: 'train' | 'validate', q0: number[], forced: boolean): Recording {
  const simulated = simulateRecording(doublePendulum, {
    initial: { q: q0, dq: [0, 0] },
    duration: 4,
    sampleStep: 0.01,
    ...(forced ? { forces: forcesOf(...doublePendulumTorques) } : {}),
  });
  return { name, role, time: simulated.time, positions: simulated.q, velocities: [null, null], forces: forced ? simulated.u : null };
}

describe('model details (everything the model view shows)', function () {
  this.timeout(60_000);
  const train = recording('train.csv', 'train', [0.6, -0.3], true);
  const held = recording('held-out.csv', 'validate', [-0.5, 0.9], false);

  it('checks the mass matrix on every recording and simulates the validation recordings only', () => {
    const details = workOutModelDetails(document, [train, held], { threshold: 0.01 });
    expect(() => modelDetailsSchema.parse(JSON.parse(JSON.stringify(details)))).not.to.throw();
    expect(details.massMatrixChecks.map((c) => c.recording)).to.deep.equal(['train.csv', 'held-out.csv']);
    expect(details.massMatrixChecks.every((c) => c.notPositiveDefinite === 0)).to.equal(true);
    expect(details.validations.map((v) => v.figures.recording)).to.deep.equal(['held-out.csv']);
    const figures = details.validations[0]!.figures;
    expect(figures.status).to.equal('finished');
    expect(figures.maxError).to.be.below(1e-5);
    expect(figures.timeToThreshold).to.equal(null);
    expect(figures.passive).to.equal(true);
    expect(figures.energyDrift!.relative).to.be.below(1e-7);
    expect(details.settings).to.deep.equal({
      threshold: 0.01,
      estimator: { method: 'savitzky-golay', window: 9, order: 6 },
      forceInterpolation: 'cubic',
      rtol: 1e-9,
    });
    expect(details.warnings).to.deep.equal([]);
    expect(details.caution).to.equal(safetyCaution);
  });

  it('thins the plotted series and keeps the last sample', () => {
    const details = workOutModelDetails(document, [held], { plotPoints: 100 });
    const trajectory = details.validations[0]!.trajectory;
    expect(trajectory.time.length).to.be.at.most(101);
    expect(trajectory.time[trajectory.time.length - 1]).to.equal(4);
    expect(Object.keys(trajectory.simulated)).to.deep.equal(['th1', 'th2']);
    expect(trajectory.recorded['th1']![0]).to.equal(held.positions[0]![4]);
  });

  it('simulates the training recordings when there is no validation recording, and says so', () => {
    const details = workOutModelDetails(document, [train]);
    expect(details.validations.map((v) => v.figures.role)).to.deep.equal(['train']);
    expect(details.warnings.join(' ')).to.contain('No validation recording');
  });

  it('names a recording it cannot use in the warnings instead of failing', () => {
    const short: Recording = { ...held, name: 'short.csv', time: held.time.slice(0, 5), positions: held.positions.map((p) => p.slice(0, 5)) };
    const details = workOutModelDetails(document, [short, held]);
    expect(details.warnings.join(' ')).to.contain('short.csv could not be used');
    expect(details.validations).to.have.length(1);
  });

  describe('the fit residual (energy balance dE/dt = P, method.md section 2)', () => {
    it('is worked out on every recording in the form of the sweep, small against the sizes it balances', () => {
      // The document names the balance form and no windows: the description defaults (20 intervals every 5 samples).
      const details = workOutModelDetails(document, [train, held]);
      const residuals = details.fitResiduals!;
      expect(residuals.form).to.equal('balance');
      expect(residuals.balance).to.deep.equal({ window: 20, stride: 5, integration: 'simpson' });
      expect(residuals.recordings.map((r) => [r.recording, r.role])).to.deep.equal([['train.csv', 'train'], ['held-out.csv', 'validate']]);
      const [forced, passive] = residuals.recordings;
      // 401 samples less 4 trimmed at each end by the window-9 estimator leave 393; windows start every 5
      // samples while 20 intervals still fit: floor((393 - 1 - 20) / 5) + 1 = 75.
      expect(forced!.rows).to.equal(75);
      expect(forced!.rms).to.be.below(1e-3 * forced!.powerRms);
      expect(passive!.powerRms).to.equal(0);
      expect(passive!.rms).to.be.below(1e-3 * passive!.partsRms);
    });

    it('follows the form and windows the sweep ran with, and thins the series', () => {
      const derivative = workOutModelDetails(
        { ...document, provenance: { ...document.provenance, form: 'derivative' } },
        [train],
        { plotPoints: 100 },
      ).fitResiduals!;
      expect(derivative.form).to.equal('derivative');
      expect(derivative.balance).to.equal(null);
      const series = derivative.recordings[0]!;
      expect(series.rows).to.equal(393);
      expect(series.time.length).to.be.at.most(100);
      expect(series.time.at(-1)).to.equal(train.time[400 - 4]);
      const windows = { window: 40, stride: 10, integration: 'trapezoid' as const };
      const balance = workOutModelDetails({ ...document, provenance: { ...document.provenance, sweep: { balance: windows } } }, [train]).fitResiduals!;
      expect(balance.balance).to.deep.equal(windows);
    });

    it('grows large when a coefficient is 5 % wrong', () => {
      const wrong = { ...document, energy: { ...document.energy, terms: document.energy.terms.map((t) => (t.term === 'cos(th2)' ? { ...t, coefficient: t.coefficient * 1.05 } : t)) } };
      const forced = workOutModelDetails(wrong, [train]).fitResiduals!.recordings[0]!;
      expect(forced.rms).to.be.above(5e-2 * forced.powerRms);
    });

    it('is optional in stored details, which were saved before it existed', () => {
      const { fitResiduals: _left, ...stored } = workOutModelDetails(document, [held]);
      expect(modelDetailsSchema.safeParse(JSON.parse(JSON.stringify(stored))).success).to.equal(true);
    });
  });

  describe('the printable report', () => {
    const html = exportReport(workOutModelDetails(document, [train, held], { threshold: 0.01 }));

    it('is one self-contained page: no scripts, no links, nothing loaded from elsewhere', () => {
      expect(html).to.match(/^<!doctype html>/);
      expect(html).not.to.match(/<script|<link|<img|src=|href=|@import|url\(/i);
      // The only address is the SVG namespace, which is a name, not a download.
      expect(html.match(/https?:\/\/[^"\s]+/g)!.every((a) => a === 'http://www.w3.org/2000/svg')).to.equal(true);
    });

    it('shows the caution, the formulas, the coefficients, the figures and the plots', () => {
      expect(html).to.contain(safetyCaution);
      expect(html).to.contain(`E = ${document.energy.expression}`).and.to.contain(`L = ${document.lagrangian.expression}`);
      expect(html).to.contain('\\ddot{\\theta}_{1}');
      for (const term of Object.keys(doublePendulum.lagrangianTerms)) expect(html).to.contain(`<code>${term}</code>`);
      expect(html).to.contain('held-out.csv (validate)');
      // Per coordinate: simulated against recorded; one chart of the error over time; one of the fit residual.
      expect(html.match(/<svg /g)).to.have.length(4);
      expect(html).to.contain('error over time');
      expect(html).to.contain('Fit residual over time').and.to.contain('Balance form: per window of 20 sample intervals every 5 samples');
    });

    it('escapes text from the model (the title here)', () => {
      expect(html).to.contain('double pendulum &lt;handbook&gt;');
      expect(html).not.to.contain('<handbook>');
    });
  });

  it('chooses tick values at 1, 2 or 5 times a power of ten (common practice, no source)', () => {
    expect(niceTicks(0, 4, 8)).to.deep.equal([0, 0.5, 1, 1.5, 2, 2.5, 3, 3.5, 4]);
    expect(niceTicks(-0.013, 0.021, 5)).to.deep.equal([-0.01, 0, 0.01, 0.02]);
  });
});

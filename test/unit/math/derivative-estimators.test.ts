import { expect } from 'chai';
import { derivativeTrim, estimateDerivatives, type DerivativeSettings } from '../../../shared/math/derivative-estimators.js';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import { samplingStatistics } from '../../../shared/math/sampling-statistics.js';
import { createSeededRandom } from '../../../shared/math/seeded-random.js';

type Output = 'position' | 'velocity' | 'acceleration';

/**
 * Convolution weights of an estimator, read off its response to a unit impulse on a unit time step:
 * output_i = sum_j w_j x_(i - half + j), so an impulse at p gives w_j at output p + half - j.
 */
function impulseWeights(settings: Extract<DerivativeSettings, { method: 'savitzky-golay' }>, output: Output, step = 1): number[] {
  const half = (settings.window - 1) / 2;
  const n = 2 * settings.window + 1;
  const impulseAt = settings.window;
  const time = Float64Array.from({ length: n }, (_, k) => 3 + k * step);
  const position = new Float64Array(n);
  position[impulseAt] = 1;
  const estimate = estimateDerivatives(time, position, settings)[output];
  return Array.from({ length: settings.window }, (_, j) => estimate[impulseAt + half - j]);
}

function expectWeights(actual: number[], numerators: number[], denominator: number): void {
  expect(actual).to.have.length(numerators.length);
  actual.forEach((w, j) => expect(w).to.be.closeTo(numerators[j] / denominator, 1e-13));
}

function polynomial(coefficients: number[]) {
  return {
    value: (t: number) => coefficients.reduce((s, c, j) => s + c * t ** j, 0),
    slope: (t: number) => coefficients.reduce((s, c, j) => s + (j > 0 ? j * c * t ** (j - 1) : 0), 0),
    curvature: (t: number) => coefficients.reduce((s, c, j) => s + (j > 1 ? j * (j - 1) * c * t ** (j - 2) : 0), 0),
  };
}

function thrown(body: () => unknown): Error {
  try {
    body();
  } catch (error) {
    return error as Error;
  }
  throw new Error('expected an error');
}

describe('derivative estimators', () => {
  describe('Savitzky-Golay weights equal the published tables (Savitzky & Golay, Anal. Chem. 36 (1964) 1627)', () => {
    it('5-point quadratic smoothing is (-3, 12, 17, 12, -3)/35', () => {
      expectWeights(impulseWeights({ method: 'savitzky-golay', window: 5, order: 2 }, 'position'), [-3, 12, 17, 12, -3], 35);
    });

    it('5-point quadratic first derivative is (-2, -1, 0, 1, 2)/10', () => {
      expectWeights(impulseWeights({ method: 'savitzky-golay', window: 5, order: 2 }, 'velocity'), [-2, -1, 0, 1, 2], 10);
    });

    it('7-point quadratic smoothing is (-2, 3, 6, 7, 6, 3, -2)/21', () => {
      expectWeights(impulseWeights({ method: 'savitzky-golay', window: 7, order: 2 }, 'position'), [-2, 3, 6, 7, 6, 3, -2], 21);
    });

    it('5-point quadratic second derivative is (2, -1, -2, -1, 2)/7 (same tables, from memory)', () => {
      expectWeights(impulseWeights({ method: 'savitzky-golay', window: 5, order: 2 }, 'acceleration'), [2, -1, -2, -1, 2], 7);
    });

    it('cubic smoothing equals quadratic smoothing at the window centre (the tables list them together)', () => {
      expectWeights(impulseWeights({ method: 'savitzky-golay', window: 7, order: 3 }, 'position'), [-2, 3, 6, 7, 6, 3, -2], 21);
    });

    it('scales the derivative weights by the time step: 1/h for velocity, 1/h^2 for acceleration', () => {
      const settings = { method: 'savitzky-golay', window: 5, order: 2 } as const;
      const h = 0.004;
      expectWeights(impulseWeights(settings, 'velocity', h), [-2, -1, 0, 1, 2].map((w) => w / h), 10);
      impulseWeights(settings, 'acceleration', h).forEach((w, j) =>
        expect(w).to.be.closeTo([2, -1, -2, -1, 2][j] / 7 / (h * h), 1e-7));
    });
  });

  describe('Savitzky-Golay is exact on polynomials of its fitted degree (calculus)', () => {
    for (const [window, order] of [[7, 2], [9, 4], [21, 4], [31, 6]] as const) {
      it(`window ${window}, order ${order}`, () => {
        const uniform = createSeededRandom(window * 100 + order);
        const p = polynomial(Array.from({ length: order + 1 }, () => 2 * uniform() - 1));
        const step = 0.02;
        const time = Float64Array.from({ length: window + 40 }, (_, k) => -0.5 + k * step);
        const estimate = estimateDerivatives(time, time.map(p.value), { method: 'savitzky-golay', window, order });
        for (let k = estimate.start; k < estimate.end; k++) {
          expect(estimate.position[k]).to.be.closeTo(p.value(time[k]), 1e-11);
          expect(estimate.velocity[k]).to.be.closeTo(p.slope(time[k]), 1e-9);
          expect(estimate.acceleration[k]).to.be.closeTo(p.curvature(time[k]), 1e-7);
        }
      });
    }
  });

  describe('central differences', () => {
    const unevenTime = (count: number, seed: number, meanStep: number) => {
      const uniform = createSeededRandom(seed);
      const time = new Float64Array(count);
      for (let k = 1; k < count; k++) time[k] = time[k - 1] + meanStep * (0.5 + uniform());
      return time;
    };

    it('are exact on quadratics on a non-uniform grid (three-point formulas, calculus)', () => {
      const time = unevenTime(60, 7, 0.01);
      const p = polynomial([0.3, -1.7, 2.9]);
      const estimate = estimateDerivatives(time, time.map(p.value), { method: 'central' });
      for (let k = estimate.start; k < estimate.end; k++) {
        expect(estimate.velocity[k]).to.be.closeTo(p.slope(time[k]), 1e-9);
        expect(estimate.acceleration[k]).to.be.closeTo(5.8, 1e-6);
        expect(estimate.position[k]).to.equal(p.value(time[k]));
      }
    });

    it('estimate velocity with second-order accuracy on a non-uniform grid (halving the steps quarters the error)', () => {
      const worstVelocityError = (meanStep: number) => {
        const time = unevenTime(Math.round(2 / meanStep), 9, meanStep);
        const estimate = estimateDerivatives(time, time.map(Math.sin), { method: 'central' });
        let worst = 0;
        for (let k = estimate.start; k < estimate.end; k++) worst = Math.max(worst, Math.abs(estimate.velocity[k] - Math.cos(time[k])));
        return worst;
      };
      const ratio = worstVelocityError(0.02) / worstVelocityError(0.01);
      expect(ratio).to.be.within(3, 5.5);
    });
  });

  describe('edges are trimmed, never extrapolated', () => {
    it('central differences lose one sample at each end', () => {
      const time = Float64Array.from({ length: 10 }, (_, k) => k);
      const estimate = estimateDerivatives(time, time.map((t) => t * t), { method: 'central' });
      expect(derivativeTrim({ method: 'central' })).to.equal(1);
      expect([estimate.start, estimate.end]).to.deep.equal([1, 9]);
      expect(estimate.velocity[0]).to.be.NaN;
      expect(estimate.acceleration[9]).to.be.NaN;
      expect(estimate.velocity).to.have.length(10);
    });

    it('Savitzky-Golay loses (window - 1)/2 samples at each end', () => {
      const settings = { method: 'savitzky-golay', window: 9, order: 3 } as const;
      const time = Float64Array.from({ length: 30 }, (_, k) => k * 0.1);
      const estimate = estimateDerivatives(time, time.map(Math.cos), settings);
      expect(derivativeTrim(settings)).to.equal(4);
      expect([estimate.start, estimate.end]).to.deep.equal([4, 26]);
      for (const output of [estimate.position, estimate.velocity, estimate.acceleration]) {
        expect(output).to.have.length(30);
        expect(output[3]).to.be.NaN;
        expect(output[26]).to.be.NaN;
        expect(output[4]).to.not.be.NaN;
        expect(output[25]).to.not.be.NaN;
      }
    });
  });

  describe('refusals say what is wrong', () => {
    const time = Float64Array.from({ length: 40 }, (_, k) => k * 0.01);
    const position = time.map(Math.sin);
    const refusal = (settings: DerivativeSettings, t = time, q = position) => thrown(() => estimateDerivatives(t, q, settings));

    it('an even window', () => {
      const error = refusal({ method: 'savitzky-golay', window: 8, order: 2 });
      expect(error).to.be.instanceOf(DiscoveryInputError);
      expect(error.message).to.match(/window must be an odd whole number of samples; got 8/);
    });

    it('an order below 2', () => {
      expect(refusal({ method: 'savitzky-golay', window: 5, order: 1 }).message).to.match(/order must be .* at least 2 .*got 1/);
    });

    it('a window shorter than order + 2', () => {
      expect(refusal({ method: 'savitzky-golay', window: 5, order: 4 }).message)
        .to.equal('The Savitzky-Golay window of 5 samples is too short for order 4: it needs at least order + 2 samples, so an odd window of 7 or more.');
      expect(() => derivativeTrim({ method: 'savitzky-golay', window: 5, order: 4 })).to.throw(/too short for order 4/);
    });

    it('a recording shorter than the window, naming the window and the sample count', () => {
      expect(refusal({ method: 'savitzky-golay', window: 9, order: 2 }, time.subarray(0, 5), position.subarray(0, 5)).message)
        .to.equal('The Savitzky-Golay window of 9 samples needs a recording of at least 9 samples; this one has 5.');
      expect(refusal({ method: 'central' }, time.subarray(0, 2), position.subarray(0, 2)).message).to.match(/at least 3 samples; this one has 2/);
    });

    it('uneven sampling for Savitzky-Golay, pointing to central differences', () => {
      const uneven = Float64Array.from(time);
      uneven[20] += 0.002;
      const error = refusal({ method: 'savitzky-golay', window: 7, order: 2 }, uneven);
      expect(error.message).to.match(/needs uniformly sampled time/);
      expect(error.message).to.match(/sample 20|sample 21/);
      expect(error.message).to.match(/central differences/);
      expect(() => estimateDerivatives(uneven, position, { method: 'central' })).to.not.throw();
    });

    it('time that does not increase', () => {
      const stalled = Float64Array.from(time);
      stalled[12] = stalled[11];
      for (const settings of [{ method: 'central' }, { method: 'savitzky-golay', window: 5, order: 2 }] as const) {
        expect(refusal(settings, stalled).message).to.match(/sample 12 .* does not come after sample 11/);
      }
    });

    it('time and position of different lengths', () => {
      expect(refusal({ method: 'central' }, time, position.subarray(0, 30)).message).to.match(/40 samples but the position has 30/);
    });
  });

  describe('sampling statistics of several recordings', () => {
    const at = (start: number, step: number, count: number) => Float64Array.from({ length: count }, (_, k) => start + k * step);

    it('reports steps within each recording only, the sample rate and the gaps', () => {
      const first = at(0, 0.01, 101);
      const second = Float64Array.from([...at(0, 0.01, 50), ...at(0.6, 0.01, 50)]); // a 0.11 s gap after sample 49
      const stats = samplingStatistics([first, second]);
      expect(stats.recordingCount).to.equal(2);
      expect(stats.sampleCount).to.equal(201);
      // Restarting at t = 0 in the second recording is not a (negative) step: recordings are never joined.
      expect(stats.steps!.min).to.be.closeTo(0.01, 1e-12);
      expect(stats.steps!.median).to.be.closeTo(0.01, 1e-12);
      expect(stats.steps!.max).to.be.closeTo(0.11, 1e-12);
      expect(stats.sampleRate).to.be.closeTo(100, 1e-8);
      expect(stats.gapCount).to.equal(1);
      expect(stats.uniform).to.equal(false);
      expect(stats.perRecording.map((r) => r.uniform)).to.deep.equal([true, false]);
    });

    it('has no steps to report for single samples', () => {
      const stats = samplingStatistics([Float64Array.of(1.5)]);
      expect(stats.steps).to.equal(null);
      expect(stats.sampleRate).to.equal(null);
    });
  });
});

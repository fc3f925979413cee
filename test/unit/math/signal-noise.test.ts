import { expect } from 'chai';
import { createNormalRandom, createSeededRandom } from '../../../shared/math/seeded-random.js';
import { recordingSignals } from '../../../shared/math/recording-signals.js';
import { measureSignalNoise } from '../../../shared/math/signal-noise.js';
import { TermSymbols } from '../../../shared/math/term-symbols.js';
import type { Recording } from '../../../shared/math/recording.js';
import type { DerivativeSettings } from '../../../shared/schemas/sweep-description.js';

function noiseOf(recording: Recording, derivatives: DerivativeSettings, needAccelerations: boolean) {
  const symbols = new TermSymbols(['x']);
  const estimated = [recordingSignals(recording, symbols, derivatives, needAccelerations)];
  return measureSignalNoise([recording], estimated, symbols, derivatives, needAccelerations, createNormalRandom(createSeededRandom(5)));
}

// Expected values from the variance of a weighted sum of independent samples, sum w_j^2 sigma^2 (any probability
// handbook; from memory): the central difference (x[k+1] - x[k-1]) / 2h has noise sigma / (h sqrt 2), the second
// difference (x[k+1] - 2 x[k] + x[k-1]) / h^2 has noise sigma sqrt 6 / h^2. The signal x = A sin(w t) over whole
// periods has velocity rms A w / sqrt 2 and acceleration rms A w^2 / sqrt 2. The share is taken of the signal as
// estimated, noise included: n / sqrt(s^2 + n^2) for signal rms s and independent noise rms n.
describe('signal noise: the share of noise in estimated velocities and accelerations', () => {
  const h = 0.01;
  const amplitude = 0.8;
  const omega = 2 * Math.PI * 0.5;
  const sigma = 1e-4;

  function noisySine(seed: number): Recording {
    const normal = createNormalRandom(createSeededRandom(seed));
    const time = Float64Array.from({ length: 2001 }, (_, k) => k * h);
    const position = time.map((t) => amplitude * Math.sin(omega * t) + sigma * normal());
    return { name: 'sine', role: 'train', time, positions: [position], velocities: [null], forces: null };
  }

  it('estimates the position noise and the noise shares of central differences as the variance formula gives', () => {
    const [noise] = noiseOf(noisySine(3), { method: 'central' }, true);
    expect(noise!.coordinate).to.equal('x');
    expect(noise!.positionNoise).to.be.closeTo(sigma, 0.1 * sigma);
    const share = (noise: number, signal: number) => noise / Math.hypot(noise, signal);
    const velocityShare = share(sigma / (h * Math.SQRT2), (amplitude * omega) / Math.SQRT2);
    const accelerationShare = share((sigma * Math.sqrt(6)) / h ** 2, (amplitude * omega ** 2) / Math.SQRT2);
    expect(accelerationShare, 'a case where noise and signal are of one size').to.be.within(0.2, 0.6);
    expect(noise!.velocityShare).to.be.closeTo(velocityShare, 0.12 * velocityShare);
    expect(noise!.accelerationShare!).to.be.closeTo(accelerationShare, 0.12 * accelerationShare);
  });

  it('reports no acceleration share when the form needs none, and next to no noise on a clean signal', () => {
    const time = Float64Array.from({ length: 2001 }, (_, k) => k * h);
    const clean: Recording = {
      name: 'clean',
      role: 'train',
      time,
      positions: [time.map((t) => amplitude * Math.sin(omega * t))],
      velocities: [null],
      forces: null,
    };
    const settings = { method: 'savitzky-golay', window: 9, order: 4 } as const;
    const [noise] = noiseOf(clean, settings, false);
    expect(noise!.accelerationShare).to.equal(null);
    expect(noise!.velocityShare).to.be.below(1e-6);
  });
});

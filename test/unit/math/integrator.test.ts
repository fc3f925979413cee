import { expect } from 'chai';
import { integrate, IntegrationError, outputState, type OdeRightSide } from '../../../shared/math/integrator.js';

// Restricted three-body problem of the Arenstorf orbit, Hairer, Norsett & Wanner, Solving ODEs I, sec. II.0 (eq. 0.1).
const ARENSTORF_MU = 0.012277471;
const ARENSTORF_START = [0.994, 0, 0, -2.00158510637908252240537862224];
const ARENSTORF_PERIOD = 17.0652165601579625588917206249;

const arenstorf: OdeRightSide = (_t, y, dydt) => {
  const mu = ARENSTORF_MU, muPrime = 1 - mu;
  const [y1, y2, v1, v2] = y;
  const d1 = ((y1 + mu) ** 2 + y2 ** 2) ** 1.5;
  const d2 = ((y1 - muPrime) ** 2 + y2 ** 2) ** 1.5;
  dydt[0] = v1;
  dydt[1] = v2;
  dydt[2] = y1 + 2 * v2 - (muPrime * (y1 + mu)) / d1 - (mu * (y1 - muPrime)) / d2;
  dydt[3] = y2 - 2 * v1 - (muPrime * y2) / d1 - (mu * y2) / d2;
};

// Our own pendulum: a 0.52 m rod, standard gravity g0 = 9.80665 m/s^2 (CGPM 1901). th from the downward vertical.
const ROD = 0.52;
const G0 = 9.80665;
const pendulum: OdeRightSide = (_t, y, dydt) => {
  dydt[0] = y[1];
  dydt[1] = -(G0 / ROD) * Math.sin(y[0]);
};
/** Energy per unit mass times 1/l^2 is enough for a relative drift: dth^2/2 - (g/l) cos th. */
const pendulumEnergy = (th: number, dth: number) => 0.5 * dth * dth - (G0 / ROD) * Math.cos(th);

/** Complete elliptic integral K(k) by the arithmetic-geometric mean, Abramowitz & Stegun 17.6. */
function completeEllipticK(k: number): number {
  let a = 1, b = Math.sqrt(1 - k * k);
  // Converges quadratically; a fixed count avoids waiting on a last-bit oscillation.
  for (let i = 0; i < 30; i++) [a, b] = [(a + b) / 2, Math.sqrt(a * b)];
  return Math.PI / (2 * a);
}

function maxAbsDifference(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

function linspace(a: number, b: number, count: number): Float64Array {
  return Float64Array.from({ length: count }, (_, k) => a + ((b - a) * k) / (count - 1));
}

/** Time of the first upward zero crossing of th after tFrom, by cubic Hermite interpolation of (th, dth) samples. */
function firstUpwardCrossing(times: Float64Array, th: number[], dth: number[], tFrom: number): number {
  for (let k = 1; k < times.length; k++) {
    if (times[k - 1] < tFrom || !(th[k - 1] < 0 && th[k] >= 0)) continue;
    const h = times[k] - times[k - 1];
    const hermite = (s: number) => {
      const s2 = s * s, s3 = s2 * s;
      return (2 * s3 - 3 * s2 + 1) * th[k - 1] + (s3 - 2 * s2 + s) * h * dth[k - 1]
        + (-2 * s3 + 3 * s2) * th[k] + (s3 - s2) * h * dth[k];
    };
    let lo = 0, hi = 1;
    for (let i = 0; i < 200 && hi - lo > 1e-15; i++) {
      const mid = (lo + hi) / 2;
      if (hermite(mid) < 0) lo = mid; else hi = mid;
    }
    return times[k - 1] + h * (lo + hi) / 2;
  }
  throw new Error('no upward crossing found');
}

describe('adaptive Dormand-Prince integrator', () => {
  it('closes the Arenstorf orbit after one period (Hairer, Norsett & Wanner, Solving ODEs I, sec. II.0)', () => {
    const result = integrate(arenstorf, 0, ARENSTORF_START, ARENSTORF_PERIOD, { rtol: 1e-10, atol: 1e-10 });
    expect(result.status).to.equal('finished');
    expect(result.t).to.equal(ARENSTORF_PERIOD);
    // Measured at rtol = atol = 1e-10: positions within 1.5e-8, velocities within 2.4e-6 of the start
    // (the velocities pass close to the small body, where errors are amplified).
    const positionClosure = maxAbsDifference(result.y.subarray(0, 2), ARENSTORF_START.slice(0, 2));
    const velocityClosure = maxAbsDifference(result.y.subarray(2, 4), ARENSTORF_START.slice(2, 4));
    expect(positionClosure).to.be.below(1e-7);
    expect(velocityClosure).to.be.below(1e-5);
  });

  it('closes the Arenstorf orbit with an error proportional to the tolerance (a fifth-order method at work)', () => {
    const closure = (tol: number) => maxAbsDifference(
      integrate(arenstorf, 0, ARENSTORF_START, ARENSTORF_PERIOD, { rtol: tol, atol: tol }).y, ARENSTORF_START);
    const ratio = closure(1e-10) / closure(1e-12);
    // Tolerance proportionality: 100 times tighter tolerance, about 100 times smaller error (measured 83).
    expect(ratio).to.be.within(30, 300);
  });

  it('needs fewer steps for the Arenstorf orbit at looser tolerance and still closes roughly', () => {
    const loose = integrate(arenstorf, 0, ARENSTORF_START, ARENSTORF_PERIOD, { rtol: 1e-7, atol: 1e-7 });
    const tight = integrate(arenstorf, 0, ARENSTORF_START, ARENSTORF_PERIOD, { rtol: 1e-10, atol: 1e-10 });
    expect(loose.statistics.acceptedSteps).to.be.below(tight.statistics.acceptedSteps);
    expect(maxAbsDifference(loose.y, ARENSTORF_START)).to.be.below(1e-2);
  });

  it('solves y\' = -y to tolerance against the closed form exp(-t)', () => {
    const times = linspace(0, 5, 51);
    const result = integrate((_t, y, d) => { d[0] = -y[0]; }, 0, [1], 5, { rtol: 1e-10, atol: 1e-12, outputTimes: times });
    expect(result.outputCount).to.equal(51);
    for (let k = 0; k < times.length; k++) {
      expect(outputState(result, k)[0]).to.be.closeTo(Math.exp(-times[k]), 1e-9 * Math.exp(-times[k]) + 1e-12);
    }
  });

  it('solves the harmonic oscillator x\'\' = -w^2 x against x = cos(w t), v = -w sin(w t)', () => {
    const w = 2.3;
    const result = integrate((_t, y, d) => { d[0] = y[1]; d[1] = -w * w * y[0]; }, 0, [1, 0], 10,
      { rtol: 1e-10, atol: 1e-12 });
    expect(result.y[0]).to.be.closeTo(Math.cos(w * 10), 1e-8);
    expect(result.y[1]).to.be.closeTo(-w * Math.sin(w * 10), 1e-8);
  });

  it('serves output times from dense output without shortening the steps', () => {
    const w = 1.7;
    const f: OdeRightSide = (_t, y, d) => { d[0] = y[1]; d[1] = -w * w * y[0]; };
    const times = linspace(0, 20, 20001);
    const plain = integrate(f, 0, [1, 0], 20, { rtol: 1e-9, atol: 1e-12 });
    const dense = integrate(f, 0, [1, 0], 20, { rtol: 1e-9, atol: 1e-12, outputTimes: times });
    expect(dense.statistics.acceptedSteps).to.equal(plain.statistics.acceptedSteps);
    expect(dense.statistics.acceptedSteps).to.be.below(times.length / 10);
    let worst = 0;
    for (let k = 0; k < times.length; k++) {
      const s = outputState(dense, k);
      worst = Math.max(worst, Math.abs(s[0] - Math.cos(w * times[k])), Math.abs(s[1] + w * Math.sin(w * times[k])));
    }
    expect(worst).to.be.below(1e-7);
  });

  it('uses first-same-as-last: six evaluations per attempted step plus the start and the initial-step probe', () => {
    const result = integrate(pendulum, 0, [1, 0], 3, { rtol: 1e-8, atol: 1e-10 });
    const { acceptedSteps, rejectedSteps, evaluations } = result.statistics;
    expect(evaluations).to.equal(6 * (acceptedSteps + rejectedSteps) + 2);
  });

  it('conserves the energy of a passive pendulum to the integrator tolerance (physics: passive motion conserves E)', () => {
    const times = linspace(0, 30, 3001);
    const result = integrate(pendulum, 0, [2.0, 0], 30, { rtol: 1e-10, atol: 1e-10, outputTimes: times });
    const e0 = pendulumEnergy(2.0, 0);
    let drift = 0;
    for (let k = 0; k < times.length; k++) {
      const [th, dth] = outputState(result, k);
      drift = Math.max(drift, Math.abs(pendulumEnergy(th, dth) - e0) / Math.abs(e0));
    }
    // Measured 9.3e-9 over 30 s (about 20 swings, 2872 steps) at rtol = atol = 1e-10.
    expect(drift).to.be.below(2e-8);
  });

  describe('large-swing pendulum period, Abramowitz & Stegun 17.3: T = 4 sqrt(l/g) K(sin(th0/2))', () => {
    const ratioAt90 = (2 * completeEllipticK(Math.SQRT1_2)) / Math.PI;

    it('the AGM value of 2K(1/sqrt 2)/pi agrees with the quoted 1.18034 (checks.md, from memory)', () => {
      expect(ratioAt90).to.be.closeTo(1.18034, 5e-6);
    });

    it('the simulated period at th0 = 90 degrees equals the elliptic-integral period', () => {
      const t0 = 2 * Math.PI * Math.sqrt(ROD / G0);
      const times = linspace(0, 2 * t0, 20001);
      const result = integrate(pendulum, 0, [-Math.PI / 2, 0], 2 * t0,
        { rtol: 1e-12, atol: 1e-12, outputTimes: times });
      const th: number[] = [], dth: number[] = [];
      for (let k = 0; k < times.length; k++) {
        const s = outputState(result, k);
        th.push(s[0]);
        dth.push(s[1]);
      }
      // Released from rest at -90 degrees: th crosses zero upward at T/4 and again at 5T/4.
      const first = firstUpwardCrossing(times, th, dth, 0);
      const second = firstUpwardCrossing(times, th, dth, first + 0.1 * t0);
      const simulatedRatio = (second - first) / t0;
      expect(simulatedRatio).to.be.closeTo(ratioAt90, 1e-9);
      expect(first / t0).to.be.closeTo(ratioAt90 / 4, 1e-9);
    });
  });

  describe('failures', () => {
    it('reports the time where the right side stops being finite (a mass matrix turning singular)', () => {
      // y' = 1 / sqrt(1 - t): the "mass" sqrt(1 - t) vanishes at t = 1 and is NaN beyond.
      const f: OdeRightSide = (t, _y, d) => { d[0] = 1 / Math.sqrt(1 - t); };
      let caught: unknown;
      try {
        integrate(f, 0, [0], 2, { rtol: 1e-8, atol: 1e-8 });
      } catch (e) {
        caught = e;
      }
      expect(caught).to.be.instanceOf(IntegrationError);
      const error = caught as IntegrationError;
      expect(error.t).to.be.closeTo(1, 1e-3);
      expect(error.t).to.be.at.most(1);
      expect(error.message).to.match(/t = 0\.99/);
    });

    it('stops with a clear error when maxSteps is exceeded', () => {
      expect(() => integrate(arenstorf, 0, ARENSTORF_START, ARENSTORF_PERIOD, { rtol: 1e-10, atol: 1e-10, maxSteps: 50 }))
        .to.throw(IntegrationError, /50 steps were not enough/);
    });

    it('rejects a right side that is not finite at the start, naming the time', () => {
      expect(() => integrate((_t, _y, d) => { d[0] = NaN; }, 0.5, [1], 1)).to.throw(IntegrationError, /t = 0\.5/);
    });

    it('rejects output times outside the interval or out of order', () => {
      const f: OdeRightSide = (_t, y, d) => { d[0] = -y[0]; };
      expect(() => integrate(f, 0, [1], 1, { outputTimes: [0.5, 2] })).to.throw(/outside \[0, 1\]/);
      expect(() => integrate(f, 0, [1], 1, { outputTimes: [0.5, 0.2] })).to.throw(/ascending/);
    });
  });

  it('ends the run where shouldStop says so, with the outputs reached so far', () => {
    const times = linspace(0, 10, 101);
    const result = integrate((_t, y, d) => { d[0] = -y[0]; }, 0, [1], 10,
      { rtol: 1e-9, outputTimes: times, shouldStop: (_t, y) => y[0] < 0.5 });
    expect(result.status).to.equal('stopped');
    expect(result.y[0]).to.be.below(0.5);
    expect(result.t).to.be.below(10);
    expect(result.outputCount).to.be.below(times.length);
    expect(times[result.outputCount - 1]).to.be.at.most(result.t);
  });
});

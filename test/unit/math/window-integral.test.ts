import { expect } from 'chai';
import { windowIntegral } from '../../../shared/math/window-integral.js';

describe('window integral of the power', () => {
  // Non-uniform grid: Simpson's rule with non-uniform weights integrates quadratics exactly (the rule is the
  // integral of the interpolating parabola; Abramowitz & Stegun 25.4.5 for the uniform case, from memory).
  const t = Float64Array.of(0, 0.1, 0.25, 0.3, 0.42, 0.5, 0.61, 0.8);
  const quadratic = (x: number) => 2 - 3 * x + 5 * x * x;
  const antiderivative = (x: number) => 2 * x - 1.5 * x * x + (5 / 3) * x ** 3;
  const f = Float64Array.from(t, quadratic);

  it('integrates a quadratic exactly with Simpson on a non-uniform grid, for even and odd interval counts', () => {
    for (const [from, to] of [[0, 4], [1, 6], [0, 7], [2, 5], [0, 2]]) {
      expect(windowIntegral(t, f, from!, to!, 'simpson'), `${from}..${to}`).to.be.closeTo(
        antiderivative(t[to!]!) - antiderivative(t[from!]!),
        1e-14,
      );
    }
  });

  it('gives the trapezoid sum', () => {
    let expected = 0;
    for (let k = 1; k < 5; k++) expected += ((t[k + 1]! - t[k]!) * (f[k]! + f[k + 1]!)) / 2;
    expect(windowIntegral(t, f, 1, 5, 'trapezoid')).to.be.closeTo(expected, 1e-15);
  });

  it('converges at fourth order for Simpson and second order for the trapezoid on a smooth function', () => {
    // Integral of cos over [0, 1] is sin 1. Halving the step divides the Simpson error by about 16, trapezoid by 4.
    const error = (n: number, rule: 'simpson' | 'trapezoid') => {
      const grid = Float64Array.from({ length: n + 1 }, (_, k) => k / n);
      return Math.abs(windowIntegral(grid, grid.map(Math.cos), 0, n, rule) - Math.sin(1));
    };
    expect(error(16, 'simpson') / error(32, 'simpson')).to.be.closeTo(16, 1);
    expect(error(16, 'trapezoid') / error(32, 'trapezoid')).to.be.closeTo(4, 0.1);
  });
});

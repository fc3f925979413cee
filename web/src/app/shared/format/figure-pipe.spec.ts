import { formatFigure } from './figure-pipe';

describe('formatFigure', () => {
  it('keeps a few significant digits and writes tiny or huge values with an exponent', () => {
    expect(formatFigure(0.0034217)).toBe('0.00342');
    expect(formatFigure(12.5)).toBe('12.5');
    expect(formatFigure(1.2345e-7, 3)).toBe('1.23e-7');
    expect(formatFigure(1e-4, 2)).toBe('1e-4');
    expect(formatFigure(null)).toBe('–');
  });
});

import { Pipe, type PipeTransform } from '@angular/core';

/**
 * A measured figure with a few significant digits: `0.00342`, `12.5`, `1.23e-7`. Very small and very large
 * magnitudes switch to exponent notation so columns of errors stay readable.
 */
export function formatFigure(value: number | null | undefined, digits = 3): string {
  if (value === null || value === undefined) return '–';
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude < 1e-3 || magnitude >= 1e6) {
    const [mantissa, exponent] = value.toExponential(digits - 1).split('e');
    return `${String(Number(mantissa))}e${Number(exponent)}`;
  }
  return String(Number(value.toPrecision(digits)));
}

@Pipe({ name: 'figure' })
export class FigurePipe implements PipeTransform {
  transform(value: number | null | undefined, digits = 3): string {
    return formatFigure(value, digits);
  }
}

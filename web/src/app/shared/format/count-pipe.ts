import { Pipe, type PipeTransform } from '@angular/core';

const whole = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });
const compact = new Intl.NumberFormat('en-GB', { notation: 'compact', maximumFractionDigits: 1 });

/** A count for people: `1,234,567`, or `1.2M` when asked for short. */
export function formatCount(value: number | null | undefined, short = false): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  return short && Math.abs(value) >= 10_000 ? compact.format(value) : whole.format(value);
}

@Pipe({ name: 'count' })
export class CountPipe implements PipeTransform {
  transform(value: number | null | undefined, short = false): string {
    return formatCount(value, short);
  }
}

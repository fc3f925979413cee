import { Pipe, type PipeTransform } from '@angular/core';

/** A span of time for people: `0.4 s`, `42 s`, `3 min 20 s`, `2 h 05 min`, `3 d 4 h`. */
export function formatDuration(seconds: number | null | undefined): string {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return '–';
  const s = Math.max(0, seconds);
  if (s > 0 && s < 0.01) return 'under 0.01 s';
  if (s < 10) return `${s < 1 ? s.toFixed(2) : s.toFixed(1)} s`;
  if (s < 60) return `${Math.round(s)} s`;
  const minutes = Math.floor(s / 60);
  if (minutes < 60) return `${minutes} min ${String(Math.round(s % 60)).padStart(2, '0')} s`;
  const hours = Math.floor(minutes / 60);
  if (hours < 48) return `${hours} h ${String(minutes % 60).padStart(2, '0')} min`;
  return `${Math.floor(hours / 24)} d ${hours % 24} h`;
}

@Pipe({ name: 'duration' })
export class DurationPipe implements PipeTransform {
  transform(seconds: number | null | undefined): string {
    return formatDuration(seconds);
  }
}

import type { CoefficientNoiseReport } from '../schemas/discovery-result.js';

/** The term whose coefficient noise moves most, with that change; null for a model without fitted terms. */
export function largestShift(report: CoefficientNoiseReport | null | undefined): { term: string; shift: number } | null {
  if (!report || report.shifts.length === 0) return null;
  let largest = 0;
  report.shifts.forEach((shift, j) => {
    if (shift > report.shifts[largest]!) largest = j;
  });
  return { term: report.terms[largest]!, shift: report.shifts[largest]! };
}

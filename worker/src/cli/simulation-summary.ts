import type { SimulationResult } from '../../../shared/schemas/simulation-result.js';

function figure(value: number): string {
  return value === 0 ? '0' : Math.abs(value) >= 1e4 || Math.abs(value) < 1e-3 ? value.toExponential(3) : String(Number(value.toPrecision(4)));
}

/** The readable form of a simulation: what was simulated, how far, the error figures, warnings and the caution. */
export function simulationSummary(result: SimulationResult): string {
  const f = result.figures;
  const lines = [
    `Model: L = ${result.model.lagrangian}`,
    `Recording ${result.recording}: columns ${Object.entries(result.columns).map(([k, v]) => `${k}=${v}`).join(', ')}; ` +
      `${f.passive ? 'passive (no forces)' : `forces read ${result.settings.forceInterpolation} between samples`}.`,
    `Simulated from t = ${figure(f.start)} to ${figure(f.end)} of ${figure(f.recordedEnd)} (${f.samples} samples): ${f.status}.`,
    ...f.errors.map((e) => `  ${e.coordinate}: error rms ${figure(e.rms)}, max ${figure(e.max)}`),
    f.timeToThreshold === null
      ? `The error stays within ${figure(f.threshold)} on every coordinate.`
      : `The error first exceeds ${figure(f.threshold)} after ${figure(f.timeToThreshold)} s.`,
  ];
  if (f.energyDrift) lines.push(`Energy drift: ${figure(f.energyDrift.absolute)} (${figure(f.energyDrift.relative)} of the energy's size ${figure(f.energyDrift.scale)}).`);
  lines.push(
    result.massMatrix.notPositiveDefinite === 0
      ? `Mass matrix positive definite on all ${result.massMatrix.checkedStates} recorded states.`
      : `Mass matrix NOT positive definite on ${result.massMatrix.notPositiveDefinite} of ${result.massMatrix.checkedStates} recorded states ` +
          `(${result.massMatrix.intervals.map((i) => `t ${figure(i.from)}-${figure(i.to)}`).join(', ')}).`,
  );
  for (const w of result.warnings) lines.push(`Warning: ${w}`);
  lines.push('', result.caution);
  return lines.join('\n');
}

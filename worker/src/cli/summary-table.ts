import { formatNoiseShare } from '../../../shared/math/noise-share-format.js';
import type { DiscoveryResult } from '../../../shared/schemas/discovery-result.js';

/** The readable form of a result: what was done, the leaderboard as a table, the best model, warnings. */
export function summaryText(result: DiscoveryResult): string {
  const lines: string[] = [];
  lines.push(
    `${result.evaluated} subsets evaluated, ${result.rejected} rank deficient, in ${result.seconds.toFixed(2)} s ` +
      `(${result.form} form, ${result.signals.description}, velocities ${result.signals.velocities}; ` +
      `${result.trainingRows} training rows${result.validationRows !== null ? `, ${result.validationRows} validation rows` : ''}).`,
  );
  lines.push(`Models ranked by ${result.rankedBy === 'validation' ? 'validation error' : 'BIC'}:`, '');
  const header = ['#', 'size', 'train rmse', 'valid. rmse', 'BIC', 'R^2', 'cond.', 'energy'];
  const rows = result.models.map((m, i) => [
    String(i + 1),
    String(m.size),
    m.trainRmse.toPrecision(4),
    m.validationRmse === null ? '-' : m.validationRmse.toPrecision(4),
    m.bic.toFixed(1),
    m.r2 === null ? '-' : m.r2.toFixed(6),
    m.conditionNumber.toPrecision(3),
    m.energy,
  ]);
  lines.push(...table([header, ...rows]), '');
  if (result.best) {
    lines.push(`Best energy:     E = ${result.best.energy}`, `Its Lagrangian:  L = ${result.best.lagrangian}`);
    if (result.best.notIdentifiable.length > 0) lines.push(`Not identifiable: ${result.best.notIdentifiable.join(', ')}`);
  } else lines.push('No model: every subset was rank deficient.');
  if (result.signals.noise) lines.push(noiseLine(result.signals.noise));
  if (result.coefficientNoise) lines.push(coefficientNoiseLine(result.coefficientNoise));
  for (const e of result.excluded) lines.push(`Left out: ${e.term}: ${e.reason}.`);
  for (const w of result.warnings) lines.push(`Warning: ${w}`);
  lines.push('', result.caution);
  return lines.join('\n');
}

function noiseLine(noise: NonNullable<DiscoveryResult['signals']['noise']>): string {
  const parts = noise.map(
    (n) =>
      `${n.coordinate}: position ${n.positionNoise.toPrecision(2)}, velocities ${formatNoiseShare(n.velocityShare)}` +
      (n.accelerationShare === null ? '' : `, accelerations ${formatNoiseShare(n.accelerationShare)}`),
  );
  return `Noise in the training signals (estimated): ${parts.join('; ')}.`;
}

function coefficientNoiseLine(report: NonNullable<DiscoveryResult['coefficientNoise']>): string {
  const parts = report.terms.map((term, j) => `${term} ${formatNoiseShare(report.shifts[j]!)}`);
  return `Noise effect on the best model's coefficients (change under as much noise again): ${parts.join(', ')}.`;
}

function table(rows: string[][]): string[] {
  const widths = rows[0]!.map((_, c) => Math.max(...rows.map((r) => r[c]!.length)));
  return rows.map((r) =>
    r
      .map((cell, c) => (c === r.length - 1 ? cell : c >= 1 && c <= 6 ? cell.padStart(widths[c]!) : cell.padEnd(widths[c]!)))
      .join('  '),
  );
}

// Prints the README's table of coping with noise: the double pendulum of noise.test.ts with 1e-3 rad of position
// noise, both forms, Savitzky-Golay windows of several widths (order 4). For each: whether the handbook terms were
// found, their largest coefficient error, the largest coefficient shift under as much noise again (the product's
// own estimate of that error) and which of the noise and unexplained-residual warnings fired.
// Run: npx tsx test/unit/discovery/print-window-figures.ts
import { handbookError, noisyDoublePendulum } from './noisy-double-pendulum.js';
import { runRecovery } from './recovery-harness.js';

console.log('| form | window | handbook terms found | largest coefficient error | largest shift (estimate) | warnings |');
console.log('|---|---|---|---|---|---|');
for (const form of ['balance', 'derivative'] as const) {
  for (const window of [9, 15, 21, 31]) {
    const c = noisyDoublePendulum(form, 1e-3);
    c.settings = { ...c.settings, derivatives: { method: 'savitzky-golay', window, order: 4 } };
    const result = runRecovery(c);
    const error = handbookError(result.models[0]!);
    const shift = Math.max(...result.coefficientNoise!.shifts);
    const warned = [
      ...(result.warnings.some((w) => w.startsWith('Noise:')) ? ['noise'] : []),
      ...(result.warnings.some((w) => w.includes('unexplained')) ? ['unexplained residual'] : []),
    ];
    const found = error === null ? `no (${result.models[0]!.terms.join(', ')})` : 'yes';
    console.log(`| ${form} | ${window} | ${found} | ${error === null ? '-' : `${(100 * error).toPrecision(2)} %`} | ${(100 * shift).toPrecision(2)} % | ${warned.join(', ') || 'none'} |`);
  }
}

// Prints the noise figure of the README: the double pendulum of noise.test.ts with position noise of several
// sizes, balance form against derivative form. Run: npx tsx test/unit/discovery/print-noise-figures.ts
import { doublePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { noisyDoublePendulum, handbookError } from './noisy-double-pendulum.js';
import { runRecovery } from './recovery-harness.js';

const sigmas = [0, 1e-4, 3e-4, 1e-3, 3e-3];
console.log('| position noise sigma (rad) | form | handbook terms found | largest relative coefficient error | chosen terms |');
console.log('|---|---|---|---|---|');
for (const sigma of sigmas) {
  for (const form of ['balance', 'derivative'] as const) {
    const best = runRecovery(noisyDoublePendulum(form, sigma)).models[0]!;
    const error = handbookError(best);
    const found = error !== null;
    const terms = found ? 'the five of the handbook' : best.terms.join(', ');
    console.log(`| ${sigma} | ${form} | ${found ? 'yes' : 'no'} | ${found ? error.toExponential(1) : '-'} | ${terms} |`);
  }
}
console.log(`(${doublePendulum.name}; Savitzky-Golay window 9, order 4; balance windows of 20 intervals every 5 samples)`);

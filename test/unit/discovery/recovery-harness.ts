import { expect } from 'chai';
import { create, all } from 'mathjs';
import { discover } from '../../../shared/math/discover.js';
import type { Recording } from '../../../shared/math/recording.js';
import { createSeededRandom } from '../../../shared/math/seeded-random.js';
import type { DiscoveryResult } from '../../../shared/schemas/discovery-result.js';
import { sweepSettingsSchema, type SweepSettingsInput } from '../../../shared/schemas/sweep-description.js';
import type { Mechanism } from '../../support/mechanisms/mechanism.js';
import { simulateRecording, type SimulationOptions } from '../../support/mechanisms/simulate-recording.js';

/** One run of a mechanism: where it starts, and whether the forcing is applied. */
export interface Run {
  q: number[];
  dq: number[];
  role: 'train' | 'validate';
}

export interface RecoveryCase {
  mechanism: Mechanism;
  runs: Run[];
  /** Forcing for forced data; absent for passive data (then `reference` names a true term). */
  forces?: (t: number) => number[];
  /** The true term fixed as the reference, with its handbook coefficient. */
  reference?: string;
  settings: Omit<SweepSettingsInput, 'reference' | 'coordinates'>;
  duration: number;
  sampleStep: number;
  positionNoise?: { sigma: number; seed: number };
}

/** Simulates the runs with the mechanism's handbook equations and runs the whole discovery on them. */
export function runRecovery(c: RecoveryCase): DiscoveryResult {
  const recordings: Recording[] = c.runs.map((run, k) => {
    const options: SimulationOptions = {
      initial: { q: run.q, dq: run.dq },
      duration: c.duration,
      sampleStep: c.sampleStep,
      ...(c.forces ? { forces: c.forces } : {}),
      ...(c.positionNoise ? { positionNoise: { sigma: c.positionNoise.sigma, seed: c.positionNoise.seed + k } } : {}),
    };
    const simulated = simulateRecording(c.mechanism, options);
    return {
      name: `run ${k + 1}`,
      role: run.role,
      time: simulated.time,
      positions: simulated.q,
      velocities: simulated.q.map(() => null),
      forces: c.forces ? simulated.u : null,
    };
  });
  const reference = c.reference ? { term: c.reference, coefficient: c.mechanism.energyTerms[c.reference]! } : undefined;
  const settings = sweepSettingsSchema.parse({
    coordinates: c.mechanism.coordinates,
    ...c.settings,
    ...(reference ? { reference } : {}),
  });
  return discover(settings, recordings);
}

// Terms are compared as functions, evaluated by mathjs (a general-purpose library, not our compiler), so that
// `sin(th)^2*dph^2` in the handbook table matches `dph^2*sin(th)^2` in our output.
const math = create(all, { number: 'number' });

function sameFunction(a: string, b: string, coordinates: string[]): boolean {
  const random = createSeededRandom(99);
  const fa = math.compile(a);
  const fb = math.compile(b);
  for (let k = 0; k < 6; k++) {
    const scope: Record<string, number> = {};
    for (const c of coordinates) {
      scope[c] = 3 * random() - 1.5;
      scope[`d${c}`] = 3 * random() - 1.5;
    }
    const va = fa.evaluate(scope) as number;
    const vb = fb.evaluate(scope) as number;
    if (Math.abs(va - vb) > 1e-12 * (1 + Math.abs(va))) return false;
  }
  return true;
}

/** The largest relative coefficient error of a found model against a handbook table of {term: coefficient}. */
export function expectSameTerms(
  found: { terms: string[]; coefficients: (number | null)[] },
  handbook: Record<string, number>,
  coordinates: string[],
  tolerance: number,
): number {
  const expected = Object.keys(handbook);
  expect(found.terms.length, `found ${found.terms.join(', ')}`).to.equal(expected.length);
  let worst = 0;
  for (const term of expected) {
    const index = found.terms.findIndex((t) => sameFunction(t, term, coordinates));
    expect(index, `${term} missing from ${found.terms.join(', ')}`).to.be.at.least(0);
    const coefficient = found.coefficients[index];
    expect(coefficient, term).to.be.a('number');
    const error = Math.abs((coefficient as number) / handbook[term]! - 1);
    worst = Math.max(worst, error);
  }
  expect(worst, `largest relative coefficient error`).to.be.below(tolerance);
  return worst;
}

/** Checks the best model against the mechanism's handbook energy and Lagrangian; returns the worst error. */
export function expectHandbookModel(result: DiscoveryResult, mechanism: Mechanism, tolerance = 1e-3): number {
  const best = result.models[0]!;
  const energyError = expectSameTerms(best, mechanism.energyTerms, mechanism.coordinates, tolerance);
  const lagrangianError = expectSameTerms(
    { terms: best.terms, coefficients: best.lagrangianCoefficients },
    mechanism.lagrangianTerms,
    mechanism.coordinates,
    tolerance,
  );
  expect(best.notIdentifiable).to.deep.equal([]);
  if (process.env.RECOVERY_FIGURES) printFigure(result, mechanism, energyError, lagrangianError);
  return Math.max(energyError, lagrangianError);
}

/**
 * One row of the README's recovery table, printed only when RECOVERY_FIGURES is set:
 * RECOVERY_FIGURES=1 npx mocha 'test/unit/discovery/recovery-*.test.ts'
 */
function printFigure(result: DiscoveryResult, mechanism: Mechanism, energyError: number, lagrangianError: number): void {
  const data = result.reference ? `passive, reference ${result.reference.term}` : 'forced';
  const figures = [energyError, lagrangianError].map((e) => e.toExponential(1));
  console.log(`| ${mechanism.name} | ${result.form} | ${data} | ${result.candidateCount} | ${figures.join(' | ')} |`);
}

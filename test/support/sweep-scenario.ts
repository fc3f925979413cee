import { expect } from 'chai';
import type { CandidateSetInputRaw, CandidateSetView } from '../../shared/schemas/candidate-set.js';
import { projectSummarySchema } from '../../shared/schemas/project.js';
import { recordingSchema, type RecordingMappingInput, type RecordingView } from '../../shared/schemas/recording.js';
import { candidateSetSchema } from '../../shared/schemas/candidate-set.js';
import { sweepDetailSchema, type SweepDetail, type SweepLaunchInput, type SweepRunSettingsInput } from '../../shared/schemas/sweep.js';
import type { TestAgent } from './fixtures.js';
import { cartForce, onFirstCoordinate } from './mechanisms/forcing.js';
import { cartPole } from './mechanisms/handbook-mechanisms.js';
import { recordingToCsv, simulateRecording } from './mechanisms/simulate-recording.js';

/*
 * The sweep scenario of the integration tests: the cart with a pole of the control textbooks
 * (test/support/mechanisms/cart-pole.ts), forced on the cart, recorded at 100 samples/s for 4 s from our own
 * initial states, written as CSV with column names a data logger might use.
 */

export interface CartPoleRun {
  q: [number, number];
  dq: [number, number];
}

/** Three training runs and one held out for validation (the same starts as the unit recovery test). */
export const cartPoleTrainingRuns: CartPoleRun[] = [
  { q: [0, 2.6], dq: [0.4, 0] },
  { q: [0.3, -2.9], dq: [-0.6, 1.0] },
  { q: [-0.2, 1.9], dq: [0.2, -0.7] },
];
export const cartPoleValidationRun: CartPoleRun = { q: [0.1, 3.0], dq: [0, 2.0] };

export const cartPoleHeader = 't_s,cart_x_m,pole_angle_rad,cart_force_N';

/** One forced run as CSV text, header `t_s,cart_x_m,pole_angle_rad,cart_force_N`. */
export function cartPoleCsv(run: CartPoleRun, duration = 4, sampleStep = 0.01): string {
  const simulated = simulateRecording(cartPole, { initial: run, duration, sampleStep, forces: onFirstCoordinate(cartForce, 2) });
  const csv = recordingToCsv(simulated, ['x', 'th'], { forces: ['x'] });
  return csv.replace(/^[^\n]*\n/, `${cartPoleHeader}\n`);
}

export const cartPoleMapping: RecordingMappingInput = {
  time: { column: 't_s', unit: 's' },
  coordinates: [
    { name: 'x', column: 'cart_x_m', unit: 'm', force: { column: 'cart_force_N', unit: 'N' } },
    { name: 'th', column: 'pole_angle_rad', unit: 'rad' },
  ],
};

/**
 * Candidate terms for the cart-pole from the generator (th the only angle) with coordinate powers up to
 * degree `polynomialDegree` and kinetic factors up to degree 1 in the coordinates: the four handbook terms
 * are among them. Degree 4 gives 34 terms; adding velocity degree 3 gives 58.
 */
export function cartPoleGenerator(options: { polynomialDegree?: number; velocityDegree?: number } = {}) {
  return { angles: ['th'], polynomialDegree: options.polynomialDegree ?? 4, kineticPolynomialDegree: 1, velocityDegree: options.velocityDegree ?? 2 };
}

export async function createProject(agent: TestAgent, name: string): Promise<string> {
  const response = await agent.post('/api/projects', { name, description: 'integration test project' });
  expect(response.status, await response.clone().text()).to.equal(201);
  return projectSummarySchema.parse(await response.json()).id;
}

export function csvForm(csv: string, fileName: string, mapping?: unknown, name?: string): FormData {
  const form = new FormData();
  form.append('file', new Blob([csv], { type: 'text/csv' }), fileName);
  if (mapping !== undefined) form.append('mapping', typeof mapping === 'string' ? mapping : JSON.stringify(mapping));
  if (name !== undefined) form.append('name', name);
  return form;
}

export async function uploadRecording(agent: TestAgent, projectId: string, csv: string, fileName: string, mapping = cartPoleMapping): Promise<RecordingView> {
  const response = await agent.postForm(`/api/projects/${projectId}/recordings`, csvForm(csv, fileName, mapping));
  expect(response.status, await response.clone().text()).to.equal(201);
  return recordingSchema.parse(await response.json());
}

/** Generates terms through the API and saves them as a candidate set. */
export async function createGeneratedCandidateSet(
  agent: TestAgent,
  projectId: string,
  name: string,
  generator: ReturnType<typeof cartPoleGenerator>,
  extra: Partial<CandidateSetInputRaw> = {},
): Promise<CandidateSetView> {
  const generated = await agent.post(`/api/projects/${projectId}/candidate-sets/generate`, { coordinates: ['x', 'th'], generator });
  expect(generated.status, await generated.clone().text()).to.equal(200);
  const { terms } = (await generated.json()) as { terms: { text: string }[] };
  const body: CandidateSetInputRaw = { name, coordinates: ['x', 'th'], terms: terms.map((t) => t.text), generator, ...extra };
  const response = await agent.post(`/api/projects/${projectId}/candidate-sets`, body);
  expect(response.status, await response.clone().text()).to.equal(201);
  return candidateSetSchema.parse(await response.json());
}

/** Settings of the recovery test (savitzky-golay 9/6, balance form), with the largest size to sweep. */
export function cartPoleSettings(maxSize: number): SweepRunSettingsInput {
  return { sizes: { min: 1, max: maxSize }, form: 'balance', derivatives: { method: 'savitzky-golay', window: 9, order: 6 }, top: 5 };
}

export interface CartPoleProject {
  projectId: string;
  recordings: RecordingView[];
  candidateSet: CandidateSetView;
  /** A launch body over the three training recordings. */
  launch(maxSize: number, name?: string): SweepLaunchInput;
}

/**
 * A project with the three forced training recordings and the 58-term candidate set. Sizes up to 7 make
 * 346,188,399 subsets (sum of C(58, s) for s = 1..7; Knuth, TAOCP 4A, 7.2.1.3): some seconds of work, so
 * progress, cancel and crashes can be watched while shards run.
 */
export async function setUpCartPoleProject(agent: TestAgent, name: string): Promise<CartPoleProject> {
  const projectId = await createProject(agent, name);
  const recordings: RecordingView[] = [];
  for (const [i, run] of cartPoleTrainingRuns.entries()) recordings.push(await uploadRecording(agent, projectId, cartPoleCsv(run), `run-${i + 1}.csv`));
  const candidateSet = await createGeneratedCandidateSet(agent, projectId, 'Generated, velocity degree 3', cartPoleGenerator({ velocityDegree: 3 }));
  return {
    projectId,
    recordings,
    candidateSet,
    launch: (maxSize, sweepName) => ({
      ...(sweepName ? { name: sweepName } : {}),
      candidateSetId: candidateSet.id,
      trainingRecordingIds: recordings.map((r) => r.id),
      settings: cartPoleSettings(maxSize),
    }),
  };
}

/** Launches and returns the sweep, failing loudly on any refusal. */
export async function launchSweep(agent: TestAgent, projectId: string, body: SweepLaunchInput): Promise<SweepDetail> {
  const response = await agent.post(`/api/projects/${projectId}/sweeps`, body);
  expect(response.status, await response.clone().text()).to.equal(201);
  return sweepDetailSchema.parse(await response.json());
}

export async function readSweep(agent: TestAgent, sweepId: string): Promise<SweepDetail> {
  return sweepDetailSchema.parse(await (await agent.get(`/api/sweeps/${sweepId}`)).json());
}

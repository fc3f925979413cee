import { expect } from 'chai';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { CandidateSetView } from '../../shared/schemas/candidate-set.js';
import { sweepDetailSchema, type SweepDetail, type SweepRunSettingsInput } from '../../shared/schemas/sweep.js';
import { createTeamWithUsers, signIn, type TeamWithUsers, type TestAgent } from './fixtures.js';
import {
  cartPoleCsv,
  cartPoleGenerator,
  cartPoleTrainingRuns,
  cartPoleValidationRun,
  createGeneratedCandidateSet,
  createProject,
  uploadRecording,
} from './sweep-scenario.js';
import type { TestApp } from './test-app.js';
import { eventually, startTestWorker } from './worker-processes.js';

/*
 * A finished sweep for the model tests: the forced cart-pole of sweep-scenario.ts, three training runs and one
 * validation run, by default the 34 generated candidates (the four handbook terms among them) and sizes 1 to 4
 * (52,955 subsets; Knuth, TAOCP 4A, 7.2.1.3), run by a real worker process. The same recordings and settings
 * are written to a folder as CSV files and a description, so the command line can run the same discovery.
 */

export const modelSweepSettings: SweepRunSettingsInput = {
  sizes: { min: 1, max: 4 },
  form: 'balance',
  derivatives: { method: 'savitzky-golay', window: 9, order: 6 },
  top: 5,
};

export interface ModelSweep {
  team: TeamWithUsers;
  analyst: TestAgent;
  projectId: string;
  candidateSet: CandidateSetView;
  sweep: SweepDetail;
  /** Folder holding the recordings as CSV and `description.json` for `conserva discover`. */
  folder: string;
  /** A launch body over the same recordings and candidates. */
  launchBody: Record<string, unknown>;
}

/** Polls the sweep until it has ended in any state. */
export async function endedSweep(agent: TestAgent, sweepId: string): Promise<SweepDetail> {
  return eventually('the sweep to end', async () => {
    const sweep = sweepDetailSchema.parse(await (await agent.get(`/api/sweeps/${sweepId}`)).json());
    return ['finished', 'failed', 'cancelled', 'halted'].includes(sweep.state) ? sweep : undefined;
  }, 110_000, 250);
}

export interface ModelSweepOptions {
  /** Generator options of the candidate set (default: cartPoleGenerator(), 34 terms). */
  generator?: ReturnType<typeof cartPoleGenerator>;
  settings?: SweepRunSettingsInput;
  /** Worker processes (default 1) and subsets per shard (default 20,000). */
  workers?: number;
  shardSubsets?: number;
}

/**
 * Sets up the team, project, recordings and candidates, and runs the sweep to its end with real worker
 * processes, which are stopped again before it returns.
 */
export async function runModelSweep(app: TestApp, label: string, projectName: string, options: ModelSweepOptions = {}): Promise<ModelSweep> {
  const settings = options.settings ?? modelSweepSettings;
  const team = await createTeamWithUsers(app.orm, label);
  const analyst = await signIn(app.baseUrl, team.analyst.email, team.password);
  const projectId = await createProject(analyst, projectName);
  const folder = mkdtempSync(path.join(tmpdir(), 'conserva-model-'));
  const runs = [...cartPoleTrainingRuns.map((run) => ({ run, role: 'train' as const })), { run: cartPoleValidationRun, role: 'validate' as const }];
  const files = runs.map(({ run, role }, i) => ({ file: `run-${i + 1}.csv`, role, csv: cartPoleCsv(run) }));
  const recordings = [];
  for (const { file, csv } of files) {
    writeFileSync(path.join(folder, file), csv);
    recordings.push(await uploadRecording(analyst, projectId, csv, file));
  }
  const set = await createGeneratedCandidateSet(analyst, projectId, 'Generated', options.generator ?? cartPoleGenerator());
  writeFileSync(
    path.join(folder, 'description.json'),
    JSON.stringify({
      coordinates: ['x', 'th'],
      terms: set.terms,
      ...settings,
      recordings: files.map(({ file, role }) => ({ file, role })),
      columns: { time: 't_s', x: 'cart_x_m', th: 'pole_angle_rad', forces: { x: 'cart_force_N' } },
    }),
  );
  const launchBody = {
    candidateSetId: set.id,
    trainingRecordingIds: recordings.slice(0, 3).map((r) => r.id),
    validationRecordingIds: [recordings[3]!.id],
    settings,
  };
  const workers = await Promise.all(
    Array.from({ length: options.workers ?? 1 }, () => startTestWorker({ shardSubsets: options.shardSubsets ?? 20_000 })),
  );
  try {
    const launched = await analyst.post(`/api/projects/${projectId}/sweeps`, launchBody);
    expect(launched.status, await launched.clone().text()).to.equal(201);
    const sweep = await endedSweep(analyst, sweepDetailSchema.parse(await launched.json()).id);
    expect(sweep.state, sweep.stateReason ?? '').to.equal('finished');
    return { team, analyst, projectId, candidateSet: set, sweep, folder, launchBody };
  } finally {
    await Promise.all(workers.map((worker) => worker.stop()));
  }
}

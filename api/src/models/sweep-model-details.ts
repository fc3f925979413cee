import { UniqueConstraintViolationException } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { DiscoveredModel } from '../../../shared/schemas/discovery-result.js';
import type { ModelDetails } from '../../../shared/schemas/model-details.js';
import type { ModelProvenance } from '../../../shared/schemas/model-document.js';
import { settingsOfSweep } from '../../../shared/sweeps/frozen-settings.js';
import type { Project } from '../entities/project.js';
import type { Sweep } from '../entities/sweep.js';
import { SweepModel } from '../entities/sweep-model.js';
import { HttpError, notFound } from '../http/http-error.js';
import { loadSignalRecordings } from '../recordings/signal-recordings.js';
import type { ModelDetailsPool } from './model-details-pool.js';
import type { ModelDetailsInput } from './model-details-task.js';

/** Why a sweep in each state other than finished has no worked-out models, in words. */
const noModelsBecause: Record<Exclude<Sweep['state'], 'finished'>, string> = {
  queued: 'The sweep has not started yet; its models are worked out once it has finished.',
  running: 'The sweep is still running; its models are worked out once it has finished.',
  cancelled:
    'The sweep was cancelled before it finished. Its leaderboard is partial and was never re-fitted and ranked, ' +
    'so it has no worked-out models to open. Launch the sweep again to get them.',
  halted:
    "The sweep was halted when the team's allowance ran out. Its leaderboard is partial and was never re-fitted " +
    'and ranked, so it has no worked-out models to open. Launch it again once the allowance allows.',
  failed: 'The sweep failed, so it has no models.',
};

/**
 * The entry of a sweep's result that a model index names: 409 for a sweep that has not finished (or ended
 * without finishing), 404 for an index past the end of its models.
 */
export function resultModelOf(sweep: Sweep, modelIndex: number): DiscoveredModel {
  if (sweep.state !== 'finished') {
    const reason = sweep.state === 'failed' && sweep.stateReason ? ` (${sweep.stateReason})` : '';
    throw new HttpError(409, 'conflict', `${noModelsBecause[sweep.state]}${reason}`);
  }
  const model = sweep.result?.models[modelIndex];
  if (!model) throw notFound('That model');
  return model;
}

/** Stored details lack what was added to the model view since they were worked out (the fit residual). */
function isOutdated(details: ModelDetails): boolean {
  return details.fitResiduals === undefined;
}

/**
 * Everything the model view shows about one model of a finished sweep (shared/model/model-details.ts). Worked
 * out on the first request and stored; later requests read the stored row. Concurrent first requests wait for
 * each other on an advisory lock keyed by sweep and index, so the model is worked out and stored once; the
 * unique (sweep, model index) pair is the last guard. A row stored before the fit residual existed is worked
 * out again once (keeping its time of writing) and replaced.
 */
export async function sweepModelDetails(
  em: EntityManager,
  pool: ModelDetailsPool,
  sweep: Sweep,
  project: Project,
  modelIndex: number,
): Promise<ModelDetails> {
  const model = resultModelOf(sweep, modelIndex);
  const stored = await findStored(em.fork(), sweep.id, modelIndex);
  if (stored && !isOutdated(stored.details)) return stored.details;
  try {
    return await em.fork().transactional(async (tx) => {
      await tx.execute('select pg_advisory_xact_lock(hashtext(?), ?)', [`sweep-model:${sweep.id}`, modelIndex]);
      const storedMeanwhile = await findStored(tx, sweep.id, modelIndex);
      if (storedMeanwhile && !isOutdated(storedMeanwhile.details)) return storedMeanwhile.details;
      const input = await modelInput(tx, sweep, project, model, modelIndex, storedMeanwhile?.details.document.createdAt ?? null);
      const details = await workOut(pool, input);
      if (storedMeanwhile) storedMeanwhile.details = details;
      else tx.create(SweepModel, { sweep: sweep.id, modelIndex, details });
      return details;
    });
  } catch (error) {
    if (!(error instanceof UniqueConstraintViolationException)) throw error;
    return (await findStored(em.fork(), sweep.id, modelIndex))!.details;
  }
}

async function findStored(em: EntityManager, sweepId: string, modelIndex: number): Promise<SweepModel | null> {
  return em.findOne(SweepModel, { sweep: sweepId, modelIndex }, { refresh: true });
}

async function workOut(pool: ModelDetailsPool, input: ModelDetailsInput): Promise<ModelDetails> {
  const answer = await pool.workOut(input);
  if ('refused' in answer) {
    throw new HttpError(409, 'conflict', `This model cannot be worked out: ${answer.refused}`);
  }
  return answer.ok;
}

/** The entry with the sweep's coordinates, its provenance (settings, estimator, recordings) and its recordings. */
async function modelInput(
  em: EntityManager,
  sweep: Sweep,
  project: Project,
  model: DiscoveredModel,
  modelIndex: number,
  createdAt: string | null,
): Promise<ModelDetailsInput> {
  const settings = settingsOfSweep(sweep.description);
  const provenance: ModelProvenance = {
    source: 'conserva sweep',
    form: settings.form,
    estimator: settings.derivatives,
    recordings: sweep.description.recordings.map((r) => ({ name: r.name, role: r.role })),
    sweep: { id: sweep.id, name: sweep.name, project: project.name, candidateSet: sweep.candidateSetName, ...settings },
    scores: null,
  };
  return {
    model,
    coordinates: sweep.description.coordinates,
    provenance,
    title: `${project.name}, ${sweep.name}, model ${modelIndex + 1}`.slice(0, 200),
    createdAt: createdAt ?? new Date().toISOString(),
    recordings: await loadSignalRecordings(em, sweep.description),
  };
}

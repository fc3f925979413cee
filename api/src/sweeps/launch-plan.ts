import type { EntityManager } from '@mikro-orm/postgresql';
import type { EstimateBasis, FrozenSweepDescription, SizeEstimate, SweepLaunch } from '../../../shared/schemas/sweep.js';
import { checkCandidateSet } from '../../../shared/sweeps/candidate-set-check.js';
import { estimateBySize, speedBasis, type MeasuredThroughput } from '../../../shared/sweeps/sweep-estimate.js';
import { CandidateSet } from '../entities/candidate-set.js';
import type { Project } from '../entities/project.js';
import { Recording } from '../entities/recording.js';
import { HttpError } from '../http/http-error.js';
import { measuredThroughput } from './measured-throughput.js';

/** A launch worked out before any allowance is consulted: the frozen description and the expected work. */
export interface LaunchPlan {
  name: string;
  candidateSet: CandidateSet;
  description: FrozenSweepDescription;
  candidateCount: number;
  knownCount: number;
  sizes: { min: number; max: number };
  perSize: SizeEstimate[];
  totalSubsets: number;
  /** CPU seconds of the shards at the speed per size: what the team is charged, and what the allowance checks. */
  cpuSeconds: number;
  /** The speed measured so far (the prepare step cuts shards by it too), and what the CPU seconds rest on. */
  measured: MeasuredThroughput;
  speed: EstimateBasis;
  warnings: string[];
}

function refused(field: string, message: string): HttpError {
  return new HttpError(400, 'invalid_body', message, { [field]: message });
}

async function loadRecordings(em: EntityManager, project: Project, ids: string[], field: string): Promise<Recording[]> {
  const found = await em.find(Recording, { id: ids, project });
  return ids.map((id, i) => {
    const recording = found.find((r) => r.id === id);
    if (!recording) throw refused(`${field}.${i}`, 'That recording does not exist in this project.');
    return recording;
  });
}

/**
 * Reads the candidate set and the recordings the launch names, checks they fit together (every recording
 * maps every coordinate; forces or a reference term fix the scale), freezes the description and estimates
 * the work. The candidate count is the set's after repeats are left out: the prepare step may screen out
 * more (columns zero on the data), so the estimate is an upper bound.
 */
export async function planLaunch(em: EntityManager, project: Project, launch: SweepLaunch): Promise<LaunchPlan> {
  const candidateSet = await em.findOne(CandidateSet, { id: launch.candidateSetId, project });
  if (!candidateSet) throw refused('candidateSetId', 'That candidate set does not exist in this project.');
  const training = await loadRecordings(em, project, launch.trainingRecordingIds, 'trainingRecordingIds');
  const validation = await loadRecordings(em, project, launch.validationRecordingIds, 'validationRecordingIds');

  const coordinates = candidateSet.coordinates;
  for (const [field, list] of [['trainingRecordingIds', training], ['validationRecordingIds', validation]] as const) {
    list.forEach((recording, i) => {
      const missing = coordinates.filter((c) => !recording.coordinates.includes(c));
      if (missing.length > 0) {
        throw refused(`${field}.${i}`, `Recording "${recording.name}" does not map the coordinate(s) ${missing.join(', ')} of candidate set "${candidateSet.name}".`);
      }
    });
  }
  const drivenCoordinate = (r: Recording) => r.mapping.coordinates.some((c) => c.force && coordinates.includes(c.name));
  if (!training.some(drivenCoordinate) && !candidateSet.reference) {
    throw refused(
      'candidateSetId',
      'The training recordings carry no forces, so the scale of the energy is free: give the candidate set a reference term with a fixed coefficient, or use recordings with force columns.',
    );
  }

  const check = checkCandidateSet({ ...candidateSet, reference: candidateSet.reference ?? null, generator: candidateSet.generator ?? null });
  if (!check.valid) throw refused('candidateSetId', `The candidate set is not valid: ${check.problems[0]?.message ?? 'unknown problem'}`);
  const { settings } = launch;
  const candidateCount = check.candidateCount;
  if (settings.sizes.min > candidateCount) {
    throw refused('settings.sizes.min', `sizes.min is ${settings.sizes.min}, but the candidate set has only ${candidateCount} candidate terms.`);
  }
  const warnings = [...check.warnings];
  const sizes = { min: settings.sizes.min, max: Math.min(settings.sizes.max, candidateCount) };
  if (sizes.max < settings.sizes.max) warnings.push(`sizes.max is ${settings.sizes.max}, but the candidate set has only ${candidateCount} candidate terms: the sweep stops at ${candidateCount}.`);

  const measured = await measuredThroughput(em);
  const perSize = estimateBySize(candidateCount, sizes, measured);
  const totalSubsets = perSize.reduce((sum, s) => sum + s.subsets, 0);
  const description: FrozenSweepDescription = {
    coordinates,
    terms: candidateSet.terms,
    known: candidateSet.known,
    reference: candidateSet.reference ?? null,
    settings,
    recordings: [
      ...training.map((r) => ({ id: r.id, name: r.name, role: 'train' as const })),
      ...validation.map((r) => ({ id: r.id, name: r.name, role: 'validate' as const })),
    ],
  };
  return {
    name: launch.name || `${candidateSet.name}, sizes ${sizes.min} to ${sizes.max}`,
    candidateSet,
    description,
    candidateCount,
    knownCount: candidateSet.known.length,
    sizes,
    perSize,
    totalSubsets,
    cpuSeconds: perSize.reduce((sum, s) => sum + s.cpuSeconds, 0),
    measured,
    speed: speedBasis(perSize, measured),
    warnings,
  };
}

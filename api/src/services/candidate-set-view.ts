import type { CandidateSetView } from '../../../shared/schemas/candidate-set.js';
import type { CandidateSet } from '../entities/candidate-set.js';

export function toCandidateSetView(set: CandidateSet): CandidateSetView {
  return {
    id: set.id,
    projectId: set.project.id,
    name: set.name,
    coordinates: set.coordinates,
    terms: set.terms,
    known: set.known,
    reference: set.reference ?? null,
    generator: set.generator ?? null,
    candidateCount: set.candidateCount,
    createdBy: set.createdById ? { id: set.createdById, name: set.createdByName ?? '' } : null,
    createdAt: set.createdAt.toISOString(),
    updatedAt: set.updatedAt.toISOString(),
  };
}

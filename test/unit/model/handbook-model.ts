import { buildModelDocument } from '../../../shared/model/model-document.js';
import type { ModelDocument } from '../../../shared/schemas/model-document.js';
import type { Mechanism } from '../../support/mechanisms/mechanism.js';

/** The model document of a mechanism's handbook energy and Lagrangian (its `energyTerms`, `lagrangianTerms`). */
export function handbookModelDocument(mechanism: Mechanism, title: string | null = mechanism.name): ModelDocument {
  return buildModelDocument({
    coordinates: mechanism.coordinates,
    energy: { terms: Object.keys(mechanism.energyTerms), coefficients: Object.values(mechanism.energyTerms) },
    lagrangian: { terms: Object.keys(mechanism.lagrangianTerms), coefficients: Object.values(mechanism.lagrangianTerms) },
    provenance: { source: 'handbook', form: null, estimator: null, recordings: [], sweep: null, scores: null },
    title,
  });
}

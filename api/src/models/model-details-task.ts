import { workOutModelDetails } from '../../../shared/model/model-details.js';
import { modelDocumentFromDiscovery } from '../../../shared/model/model-document.js';
import type { Recording } from '../../../shared/math/recording.js';
import type { DiscoveredModel } from '../../../shared/schemas/discovery-result.js';
import type { ModelDetails } from '../../../shared/schemas/model-details.js';
import type { ModelProvenance } from '../../../shared/schemas/model-document.js';
import { refusalOf, type StepAnswer } from '../../../shared/sweeps/step-answer.js';

/** One leaderboard entry of a finished sweep with what it needs to be worked out. */
export interface ModelDetailsInput {
  model: DiscoveredModel;
  coordinates: string[];
  provenance: ModelProvenance;
  title: string;
  createdAt: string;
  /** The sweep's training and validation recordings. */
  recordings: Recording[];
}

/** Thread entry: the model document of the entry, then everything the model view shows (workOutModelDetails). */
export default function runModelDetails(input: ModelDetailsInput): StepAnswer<ModelDetails> {
  return refusalOf(() => {
    const document = {
      ...modelDocumentFromDiscovery(input.model, input.coordinates, input.provenance, input.title),
      createdAt: input.createdAt,
    };
    return workOutModelDetails(document, input.recordings);
  });
}

import { DiscoveryInputError } from '../math/discovery-input-error.js';
import { formatEnergy } from '../math/energy-expression.js';
import { deriveEquationsOfMotion, type EquationsOfMotion } from '../math/euler-lagrange.js';
import { parseExpression } from '../math/term-expression.js';
import { TermSymbols } from '../math/term-symbols.js';
import type { DiscoveredModel } from '../schemas/discovery-result.js';
import {
  MODEL_FORMAT,
  MODEL_FORMAT_VERSION,
  modelDocumentSchema,
  type ModelDocument,
  type ModelProvenance,
} from '../schemas/model-document.js';
import { safeParsePlain } from '../schemas/plain-issue-message.js';
import { describeSchemaIssues } from '../schemas/sweep-description.js';
import { safetyCaution } from './safety-caution.js';

/** What a model is made of: coordinates, the energy and the Lagrangian as terms with coefficients. */
export interface ModelParts {
  coordinates: readonly string[];
  energy: { terms: readonly string[]; coefficients: readonly number[] };
  lagrangian: { terms: readonly string[]; coefficients: readonly (number | null)[] };
  provenance: ModelProvenance;
  title?: string | null;
  /** ISO 8601; left null when absent so that equal models give equal documents. */
  createdAt?: string | null;
}

/**
 * Builds the model document (our versioned JSON format, shared/schemas/model-document.ts): expressions printed
 * from the terms, equations of motion derived from the Lagrangian by Euler-Lagrange, and the caution. Throws
 * DiscoveryInputError for a term that is refused or lengths that do not match.
 */
export function buildModelDocument(parts: ModelParts): ModelDocument {
  const symbols = new TermSymbols(parts.coordinates);
  checkLengths(parts);
  const parse = (term: string) => ({ tree: parseExpression(term, symbols).tree });
  const lagrangianTerms = parts.lagrangian.terms.map((term, j) => ({ term, coefficient: parts.lagrangian.coefficients[j]! }));
  const equations = deriveEquationsOfMotion(parts.coordinates, lagrangianTerms);
  return {
    format: MODEL_FORMAT,
    version: MODEL_FORMAT_VERSION,
    title: parts.title ?? null,
    createdAt: parts.createdAt ?? null,
    coordinates: [...parts.coordinates],
    symbols: { velocities: symbols.velocities, forces: equations.forceSymbols },
    energy: {
      expression: formatEnergy(parts.energy.terms.map(parse), parts.energy.coefficients),
      terms: parts.energy.terms.map((term, j) => ({ term, coefficient: parts.energy.coefficients[j]! })),
    },
    lagrangian: {
      expression: formatEnergy(parts.lagrangian.terms.map(parse), parts.lagrangian.coefficients),
      terms: lagrangianTerms,
    },
    equations: {
      massMatrix: equations.massMatrixText,
      forceVector: equations.forceVectorText,
      leftOut: equations.leftOut,
    },
    provenance: parts.provenance,
    caution: safetyCaution,
  };
}

function checkLengths(parts: ModelParts): void {
  if (parts.energy.terms.length !== parts.energy.coefficients.length) {
    throw new DiscoveryInputError(`The energy has ${parts.energy.terms.length} terms but ${parts.energy.coefficients.length} coefficients.`);
  }
  if (parts.lagrangian.terms.length !== parts.lagrangian.coefficients.length) {
    throw new DiscoveryInputError(
      `The Lagrangian has ${parts.lagrangian.terms.length} terms but ${parts.lagrangian.coefficients.length} coefficients.`,
    );
  }
  if (parts.lagrangian.terms.length === 0) throw new DiscoveryInputError('The Lagrangian has no terms.');
}

/** The document of one discovered model (a leaderboard entry of a discovery result). */
export function modelDocumentFromDiscovery(
  model: DiscoveredModel,
  coordinates: readonly string[],
  provenance: ModelProvenance,
  title: string | null = null,
): ModelDocument {
  return buildModelDocument({
    coordinates,
    energy: { terms: model.terms, coefficients: model.coefficients },
    lagrangian: { terms: model.terms, coefficients: model.lagrangianCoefficients },
    provenance: {
      ...provenance,
      scores: provenance.scores ?? {
        trainRmse: model.trainRmse,
        validationRmse: model.validationRmse,
        bic: model.bic,
        conditionNumber: model.conditionNumber,
        legendreResidual: model.legendreResidual,
      },
    },
    title,
  });
}

/** The equations of motion of a document, derived again from its Lagrangian (the source of truth). */
export function documentEquations(document: ModelDocument): EquationsOfMotion {
  return deriveEquationsOfMotion(document.coordinates, document.lagrangian.terms);
}

/** The document as the JSON text of a `.json` file. */
export function serializeModelDocument(document: ModelDocument): string {
  return `${JSON.stringify(document, null, 2)}\n`;
}

/**
 * Reads a model document from JSON text and checks it: the format and version, the schema, and that every
 * term parses for the coordinates. Throws DiscoveryInputError naming the file and what is wrong.
 */
export function parseModelDocument(text: string, fileName: string): ModelDocument {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    throw new DiscoveryInputError(`${fileName} is not valid JSON: ${(error as Error).message}`);
  }
  const header = json as { format?: unknown; version?: unknown } | null;
  if (typeof header !== 'object' || header === null || header.format !== MODEL_FORMAT) {
    throw new DiscoveryInputError(`${fileName} is not a Conserva model document (its "format" must be "${MODEL_FORMAT}").`);
  }
  if (typeof header.version === 'number' && header.version > MODEL_FORMAT_VERSION) {
    throw new DiscoveryInputError(
      `${fileName} is a model document of version ${header.version}; this version of Conserva reads version ${MODEL_FORMAT_VERSION}.`,
    );
  }
  const parsed = safeParsePlain(modelDocumentSchema, json);
  if (!parsed.success) {
    throw new DiscoveryInputError(`${fileName} is not a valid model document:\n${describeSchemaIssues(parsed.error)}`);
  }
  try {
    const symbols = new TermSymbols(parsed.data.coordinates);
    for (const { term } of [...parsed.data.energy.terms, ...parsed.data.lagrangian.terms]) parseExpression(term, symbols);
    documentEquations(parsed.data);
  } catch (error) {
    if (error instanceof DiscoveryInputError) throw new DiscoveryInputError(`${fileName}: ${error.message}`);
    throw error;
  }
  return parsed.data;
}

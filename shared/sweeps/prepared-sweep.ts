import { prepareDiscovery, type PreparedDiscovery } from '../math/discovery-preparation.js';
import { discoveryResultOf } from '../math/discovery-result-assembly.js';
import { selectModels } from '../math/model-selection.js';
import type { Recording } from '../math/recording.js';
import type { DiscoveryResult } from '../schemas/discovery-result.js';
import type { SweepSettings } from '../schemas/sweep-description.js';
import { encodeProblemData, type ProblemMeta } from './problem-encoding.js';
import { refusalOf, type StepAnswer } from './step-answer.js';
import { leaderboardOutcome, type StoredLeaderboard } from './stored-leaderboard.js';

export type { StepAnswer } from './step-answer.js';

/** What the prepare step stores on a sweep: plain data only, so it can come back from a worker thread. */
export interface PreparedSweep {
  meta: ProblemMeta;
  data: Uint8Array;
  candidateCount: number;
  rowCount: number;
  total: number;
  excluded: { term: string; reason: string }[];
  warnings: string[];
}

function problemMetaOf(prepared: PreparedDiscovery, referenceCoefficient: number | undefined): ProblemMeta {
  const reference = prepared.set.reference;
  return {
    columnCount: prepared.problem.columnCount,
    knownCount: prepared.problem.knownCount,
    yty: prepared.problem.yty,
    scales: Array.from(prepared.scales),
    terms: prepared.training.terms.map((term) => term.text),
    reference: reference ? { term: reference.text, coefficient: referenceCoefficient! } : null,
    rowCount: prepared.training.rowCount,
    sizes: prepared.sizes,
  };
}

/** The prepare step of a sweep (shared/math/discovery-preparation.ts), reduced to what shards need. */
export function prepareSweep(settings: SweepSettings, recordings: readonly Recording[]): StepAnswer<PreparedSweep> {
  return refusalOf(() => {
    const prepared = prepareDiscovery(settings, recordings);
    return {
      meta: problemMetaOf(prepared, settings.reference?.coefficient),
      data: encodeProblemData(prepared.problem),
      candidateCount: prepared.candidateCount,
      rowCount: prepared.training.rowCount,
      total: prepared.total,
      excluded: prepared.excluded,
      warnings: prepared.warnings,
    };
  });
}

/**
 * The finish step (shared/math/model-selection.ts) on a merged leaderboard. The preparation is rebuilt from the
 * same settings and recordings, which gives the same columns as the prepare step had.
 */
export function finishSweep(
  settings: SweepSettings,
  recordings: readonly Recording[],
  board: StoredLeaderboard,
  counts: { evaluated: number; rejected: number },
  seconds: number,
): StepAnswer<DiscoveryResult> {
  return refusalOf(() => {
    const prepared = prepareDiscovery(settings, recordings);
    const outcome = leaderboardOutcome(board, counts);
    return discoveryResultOf(settings, recordings, prepared, outcome, selectModels(prepared, settings, outcome), seconds);
  });
}

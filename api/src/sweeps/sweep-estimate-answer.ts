import type { EntityManager } from '@mikro-orm/postgresql';
import type { AllowanceLimits } from '../../../shared/schemas/allowance.js';
import type { SweepEstimate } from '../../../shared/schemas/sweep.js';
import { allowanceRefusals } from '../../../shared/sweeps/sweep-estimate.js';
import type { Team } from '../entities/team.js';
import { allowanceStatus, type TeamUsage } from './allowance-ledger.js';
import type { LaunchPlan } from './launch-plan.js';
import { liveWorkerThreads } from './measured-throughput.js';

/** The estimate as the client sees it: the work, the time on the running workers, and the allowance verdict. */
export async function estimateAnswer(
  em: EntityManager,
  plan: LaunchPlan,
  team: Team,
  limits: AllowanceLimits,
  usage: TeamUsage,
): Promise<SweepEstimate> {
  const threads = await liveWorkerThreads(em);
  const refusals = allowanceRefusals({ limits, ...usage, totalSubsets: plan.totalSubsets, cpuSeconds: plan.cpuSeconds });
  const warnings = [...plan.warnings];
  if (threads === 0) warnings.push('No worker is running at the moment: a launched sweep waits in the queue until one starts.');
  return {
    candidateCount: plan.candidateCount,
    knownCount: plan.knownCount,
    sizes: plan.sizes,
    perSize: plan.perSize,
    totalSubsets: plan.totalSubsets,
    cpuSeconds: plan.cpuSeconds,
    workerThreads: threads,
    wallSeconds: threads > 0 ? plan.cpuSeconds / threads : null,
    allowance: allowanceStatus(team, limits, usage),
    fits: refusals.length === 0,
    refusals,
    warnings,
  };
}

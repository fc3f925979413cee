import type { EntityManager } from '@mikro-orm/postgresql';
import type { AllowanceLimits } from '../../../shared/schemas/allowance.js';
import type { SweepEstimate } from '../../../shared/schemas/sweep.js';
import { expectedFixedCosts, expectedWallSeconds } from '../../../shared/sweeps/fixed-costs.js';
import { DEFAULT_SHARD_SECONDS, planShards } from '../../../shared/sweeps/shard-plan.js';
import { allowanceRefusals } from '../../../shared/sweeps/sweep-estimate.js';
import type { Team } from '../entities/team.js';
import { allowanceStatus, type TeamUsage } from './allowance-ledger.js';
import type { LaunchPlan } from './launch-plan.js';
import { latestFixedCosts, liveWorkers } from './measured-throughput.js';

/** How the prepare step cuts shards when no worker has said (the worker's default). */
const defaultShardSizing = { targetSeconds: DEFAULT_SHARD_SECONDS, subsetsPerShard: null };

/**
 * The estimate as the client sees it: the work, the CPU seconds the team is charged (which the allowance
 * check uses), the wall time on the running workers with the fixed costs measured on this installation, what
 * the figures rest on, and the allowance verdict.
 */
export async function estimateAnswer(
  em: EntityManager,
  plan: LaunchPlan,
  team: Team,
  limits: AllowanceLimits,
  usage: TeamUsage,
): Promise<SweepEstimate> {
  const workers = await liveWorkers(em);
  const shardCount = planShards(plan.candidateCount, plan.sizes, plan.measured, workers.sizing ?? defaultShardSizing).length;
  const fixed = expectedFixedCosts(await latestFixedCosts(em));
  const refusals = allowanceRefusals({ limits, ...usage, totalSubsets: plan.totalSubsets, cpuSeconds: plan.cpuSeconds });
  const warnings = [...plan.warnings];
  if (workers.threads === 0) warnings.push('No worker is running at the moment: a launched sweep waits in the queue until one starts.');
  return {
    candidateCount: plan.candidateCount,
    knownCount: plan.knownCount,
    sizes: plan.sizes,
    perSize: plan.perSize,
    totalSubsets: plan.totalSubsets,
    cpuSeconds: plan.cpuSeconds,
    shardCount,
    fixedCosts: fixed.costs,
    workerThreads: workers.threads,
    wallSeconds: expectedWallSeconds({ cpuSeconds: plan.cpuSeconds, shardCount, threads: workers.threads }, fixed.costs),
    basis: { speed: plan.speed, fixedCosts: fixed.basis },
    allowance: allowanceStatus(team, limits, usage),
    fits: refusals.length === 0,
    refusals,
    warnings,
  };
}

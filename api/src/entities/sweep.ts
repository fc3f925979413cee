import { randomUUID } from 'node:crypto';
import { defineEntity, type InferEntity } from '@mikro-orm/core';
import type { DiscoveryResult } from '../../../shared/schemas/discovery-result.js';
import { sweepStates, type FrozenSweepDescription } from '../../../shared/schemas/sweep.js';
import type { ProblemMeta } from '../../../shared/sweeps/problem-encoding.js';
import type { StoredLeaderboard } from '../../../shared/sweeps/stored-leaderboard.js';
import { Project } from './project.js';
import { Team } from './team.js';

const p = defineEntity.properties;

/**
 * One launched sweep. The description is frozen at launch; the prepare step adds the scaled Gram problem
 * (problemData, lazy: only shards load it) and the shard plan; merged shards add to the counts and the
 * leaderboard; the finish step stores the worked-out result. Launcher and canceller are copied (id and name)
 * so the history outlives deleted users. Subset counts are doubles: exact up to 2^53.
 */
export const Sweep = defineEntity({
  name: 'Sweep',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    project: p.manyToOne(Project).deleteRule('cascade'),
    team: p.manyToOne(Team),
    name: p.string().length(120),
    state: p.enum([...sweepStates]).index(),
    stateReason: p.text().nullable(),
    candidateSetId: p.uuid().nullable(),
    candidateSetName: p.string().length(120),
    description: p.json<FrozenSweepDescription>(),
    launchedById: p.uuid(),
    launchedByName: p.string().length(120),
    launchedByEmail: p.string().length(254),
    launchedAt: p.datetime().onCreate(() => new Date()).index(),
    startedAt: p.datetime().nullable(),
    endedAt: p.datetime().nullable(),
    cancelledById: p.uuid().nullable(),
    cancelledByName: p.string().length(120).nullable(),
    cancelledAt: p.datetime().nullable(),
    totalSubsets: p.double().$type<number>(),
    estimatedCpuSeconds: p.double().$type<number>(),
    evaluated: p.double().$type<number>().default(0),
    rejected: p.double().$type<number>().default(0),
    cpuSeconds: p.double().$type<number>().default(0),
    shardCount: p.integer().default(0),
    shardsDone: p.integer().default(0),
    candidateCount: p.integer().nullable(),
    rowCount: p.integer().nullable(),
    excluded: p.json<{ term: string; reason: string }[]>(),
    warnings: p.json<string[]>(),
    problemMeta: p.json<ProblemMeta>().nullable(),
    problemData: p.blob().nullable().lazy(true, false),
    leaderboard: p.json<StoredLeaderboard>().nullable(),
    leaderboardVersion: p.integer().default(0),
    result: p.json<DiscoveryResult>().nullable().lazy(true, false),
    notifiedAt: p.datetime().nullable(),
  },
});
export type Sweep = InferEntity<typeof Sweep>;

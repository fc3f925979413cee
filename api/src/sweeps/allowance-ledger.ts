import type { EntityManager } from '@mikro-orm/postgresql';
import type { AllowanceLimits, AllowanceStatus } from '../../../shared/schemas/allowance.js';
import { TeamAllowance } from '../entities/team-allowance.js';

/** First instant of the calendar month (UTC) that `now` falls in: usage is counted from there. */
export function monthStart(now: Date): Date {
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), 1));
}

export function monthLabel(now: Date): string {
  return `${now.getUTCFullYear()}-${String(now.getUTCMonth() + 1).padStart(2, '0')}`;
}

/** The team's limits, created with the defaults the first time anyone asks. */
export async function ensureAllowance(em: EntityManager, teamId: string, defaults: AllowanceLimits): Promise<void> {
  await em.execute(
    'insert into team_allowance (team_id, cpu_seconds_per_month, sweeps_at_once, subsets_per_sweep, updated_at) values (?, ?, ?, ?, now()) on conflict (team_id) do nothing',
    [teamId, defaults.cpuSecondsPerMonth, defaults.sweepsAtOnce, defaults.subsetsPerSweep],
  );
}

interface AllowanceRow {
  cpu_seconds_per_month: number;
  sweeps_at_once: number;
  subsets_per_sweep: number;
}

function limitsOf(row: AllowanceRow): AllowanceLimits {
  return { cpuSecondsPerMonth: row.cpu_seconds_per_month, sweepsAtOnce: row.sweeps_at_once, subsetsPerSweep: row.subsets_per_sweep };
}

/**
 * The team's limits, with the row locked until the surrounding transaction ends (SELECT ... FOR UPDATE):
 * launches of one team queue up here, so each sees the sweeps and charges of those before it.
 */
export async function lockAllowance(tx: EntityManager, teamId: string, defaults: AllowanceLimits): Promise<AllowanceLimits> {
  await ensureAllowance(tx, teamId, defaults);
  const rows = await tx.execute<AllowanceRow[]>('select * from team_allowance where team_id = ? for update', [teamId]);
  return limitsOf(rows[0]!);
}

export async function readAllowance(em: EntityManager, teamId: string, defaults: AllowanceLimits): Promise<AllowanceLimits> {
  await ensureAllowance(em, teamId, defaults);
  const allowance = await em.findOneOrFail(TeamAllowance, { team: teamId }, { refresh: true });
  return { cpuSecondsPerMonth: allowance.cpuSecondsPerMonth, sweepsAtOnce: allowance.sweepsAtOnce, subsetsPerSweep: allowance.subsetsPerSweep };
}

export interface TeamUsage {
  cpuSecondsUsed: number;
  cpuSecondsReserved: number;
  sweepsActive: number;
}

/** CPU seconds charged this month, CPU seconds the active sweeps still expect, and how many sweeps are active. */
export async function teamUsage(em: EntityManager, teamId: string, now = new Date()): Promise<TeamUsage> {
  const [charged] = await em.execute<{ used: number | null }[]>(
    'select sum(cpu_seconds) as used from usage_charge where team_id = ? and charged_at >= ?',
    [teamId, monthStart(now)],
  );
  const [active] = await em.execute<{ count: string; reserved: number | null }[]>(
    `select count(*) as count, sum(greatest(estimated_cpu_seconds - cpu_seconds, 0)) as reserved
       from sweep where team_id = ? and state in ('queued', 'running')`,
    [teamId],
  );
  return { cpuSecondsUsed: Number(charged?.used ?? 0), cpuSecondsReserved: Number(active?.reserved ?? 0), sweepsActive: Number(active?.count ?? 0) };
}

/** CPU seconds charged to the team this month. */
export async function cpuSecondsUsed(em: EntityManager, teamId: string, now = new Date()): Promise<number> {
  const [charged] = await em.execute<{ used: number | null }[]>(
    'select sum(cpu_seconds) as used from usage_charge where team_id = ? and charged_at >= ?',
    [teamId, monthStart(now)],
  );
  return Number(charged?.used ?? 0);
}

export function allowanceStatus(team: { id: string; name: string }, limits: AllowanceLimits, usage: TeamUsage, now = new Date()): AllowanceStatus {
  return {
    ...limits,
    teamId: team.id,
    teamName: team.name,
    month: monthLabel(now),
    cpuSecondsUsed: usage.cpuSecondsUsed,
    cpuSecondsReserved: usage.cpuSecondsReserved,
    cpuSecondsRemaining: Math.max(0, limits.cpuSecondsPerMonth - usage.cpuSecondsUsed - usage.cpuSecondsReserved),
    sweepsActive: usage.sweepsActive,
  };
}

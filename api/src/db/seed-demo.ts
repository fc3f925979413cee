import type { MikroORM } from '@mikro-orm/postgresql';
import { hashPassword } from '../auth/password-hash.js';
import { AuditEvent } from '../entities/audit-event.js';
import { Project } from '../entities/project.js';
import { Team } from '../entities/team.js';
import { User } from '../entities/user.js';
import { recordAudit } from '../services/audit-trail.js';
import { demoAccounts, demoTeams, type DemoAccount } from './demo-scenario.js';

export interface DemoSeedResult {
  /** False when the demo had been seeded before (it is seeded once; later changes by people are kept). */
  seededNow: boolean;
  /** The demo accounts that still exist, for the console. */
  accounts: DemoAccount[];
}

/**
 * Seeds the demo scenario once. The `demo.seeded` audit event marks it done, so projects or users that
 * people delete later do not come back at the next start. Runs in one transaction.
 */
export async function seedDemo(orm: MikroORM): Promise<DemoSeedResult> {
  const em = orm.em.fork();
  const seededNow = await em.transactional(async (tx) => {
    if (await tx.count(AuditEvent, { action: 'demo.seeded' })) return false;
    const teams = new Map<string, Team>();
    for (const demoTeam of demoTeams) {
      const team = (await tx.findOne(Team, { name: demoTeam.name })) ?? tx.create(Team, { name: demoTeam.name });
      teams.set(demoTeam.name, team);
      for (const project of demoTeam.projects) {
        if (!(await tx.count(Project, { team, name: project.name }))) tx.create(Project, { team, ...project });
      }
    }
    for (const account of demoAccounts) {
      if (await tx.count(User, { email: account.email })) continue;
      tx.create(User, {
        email: account.email,
        name: account.name,
        role: account.role,
        team: teams.get(account.team)!,
        passwordHash: await hashPassword(account.password),
      });
    }
    recordAudit(tx, null, { action: 'demo.seeded', details: { teams: demoTeams.map((team) => team.name) } });
    return true;
  });
  const existing = new Set((await em.find(User, { email: demoAccounts.map((account) => account.email) })).map((user) => user.email));
  return { seededNow, accounts: demoAccounts.filter((account) => existing.has(account.email)) };
}

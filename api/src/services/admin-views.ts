import type { AdminTeam } from '../../../shared/schemas/team-admin.js';
import type { AdminUser } from '../../../shared/schemas/user-admin.js';
import type { AuditEventView } from '../../../shared/schemas/audit-event.js';
import type { AuditEvent } from '../entities/audit-event.js';
import type { Team } from '../entities/team.js';
import type { User } from '../entities/user.js';

export function toAdminUser(user: User): AdminUser {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    team: { id: user.team.id, name: user.team.name },
    createdAt: user.createdAt.toISOString(),
  };
}

export function toAdminTeam(team: Team, counts: { users: number; projects: number }): AdminTeam {
  return { id: team.id, name: team.name, userCount: counts.users, projectCount: counts.projects, createdAt: team.createdAt.toISOString() };
}

export function toAuditEventView(event: AuditEvent): AuditEventView {
  return {
    id: event.id,
    action: event.action,
    actorId: event.actorId ?? null,
    actorEmail: event.actorEmail ?? null,
    teamId: event.teamId ?? null,
    targetType: event.targetType ?? null,
    targetId: event.targetId ?? null,
    details: event.details,
    createdAt: event.createdAt.toISOString(),
  };
}

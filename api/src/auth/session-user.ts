import type { SessionUser } from '../../../shared/schemas/session.js';
import type { Team } from '../entities/team.js';
import type { User } from '../entities/user.js';

/** The signed-in user as stored on req.user: what routes need for role and team checks. */
export interface AuthUser {
  id: string;
  email: string;
  name: string;
  role: SessionUser['role'];
  teamId: string;
  teamName: string;
}

export function toAuthUser(user: User, team: Team): AuthUser {
  return { id: user.id, email: user.email, name: user.name, role: user.role, teamId: team.id, teamName: team.name };
}

/** The client's view of the signed-in user (never a password or hash). */
export function toSessionUser(user: AuthUser): SessionUser {
  return { id: user.id, email: user.email, name: user.name, role: user.role, team: { id: user.teamId, name: user.teamName } };
}

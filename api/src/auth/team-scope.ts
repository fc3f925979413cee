import type { AuthUser } from './session-user.js';

/** The filter that limits a query to what the user may see: their own team, or everything for admins. */
export function teamScope(user: AuthUser): { team?: string } {
  return user.role === 'admin' ? {} : { team: user.teamId };
}

import type { Role } from '../../../../shared/schemas/session';

const labels: Record<Role, string> = { admin: 'Admin', analyst: 'Analyst', viewer: 'Viewer' };

/** How a role reads on screen. */
export function roleLabel(role: Role): string {
  return labels[role];
}

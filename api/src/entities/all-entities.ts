import { AuditEvent } from './audit-event.js';
import { Project } from './project.js';
import { Team } from './team.js';
import { User } from './user.js';

/** Every entity the ORM maps; listed explicitly (no globs) so tsx and compiled code behave the same. */
export const allEntities = [Team, User, Project, AuditEvent];

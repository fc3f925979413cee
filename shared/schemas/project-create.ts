import * as z from 'zod';
import { projectInputSchema } from './project.js';

/**
 * Body of POST /api/projects. Analysts create in their own team (teamId may be left out or name it);
 * admins may name any team, and without teamId the project goes to the admin's own team.
 */
export const projectCreateSchema = projectInputSchema.extend({
  teamId: z.uuid('Choose a team.').optional(),
});
export type ProjectCreate = z.infer<typeof projectCreateSchema>;


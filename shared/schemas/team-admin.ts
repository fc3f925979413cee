import * as z from 'zod';

/** Body of POST /api/admin/teams and PATCH /api/admin/teams/:id. */
export const teamInputSchema = z.object({
  name: z.string('Give the team a name.').trim().min(1, 'Give the team a name.').max(120, 'The name can have at most 120 characters.'),
});
export type TeamInput = z.infer<typeof teamInputSchema>;

/** A team as admins see it. */
export const adminTeamSchema = z.object({
  id: z.string(),
  name: z.string(),
  userCount: z.number().int(),
  projectCount: z.number().int(),
  createdAt: z.string(),
});
export type AdminTeam = z.infer<typeof adminTeamSchema>;

/** Answer of GET /api/admin/teams. */
export const adminTeamListSchema = z.object({ teams: z.array(adminTeamSchema) });
export type AdminTeamList = z.infer<typeof adminTeamListSchema>;

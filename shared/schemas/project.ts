import * as z from 'zod';

/** Body of POST /api/projects and PATCH /api/projects/:id. */
export const projectInputSchema = z.object({
  name: z.string('Give the project a name.').trim().min(1, 'Give the project a name.').max(120, 'The name can have at most 120 characters.'),
  description: z.string('Write the description as text.').trim().max(2000, 'The description can have at most 2,000 characters.').default(''),
});
export type ProjectInput = z.infer<typeof projectInputSchema>;

export const projectSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  description: z.string(),
  teamId: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ProjectSummary = z.infer<typeof projectSummarySchema>;

/** Answer of GET /api/projects. */
export const projectListSchema = z.object({ projects: z.array(projectSummarySchema) });
export type ProjectList = z.infer<typeof projectListSchema>;

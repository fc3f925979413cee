import * as z from 'zod';

export const roles = ['admin', 'analyst', 'viewer'] as const;
export const roleSchema = z.enum(roles, 'Choose the role admin, analyst or viewer.');
export type Role = z.infer<typeof roleSchema>;

/** Body of POST /api/session (sign-in). */
export const signInSchema = z.object({
  email: z.email('Enter a valid e-mail address.').max(254, 'An e-mail address has at most 254 characters.'),
  password: z.string('Enter your password.').min(1, 'Enter your password.').max(200, 'A password has at most 200 characters.'),
});
export type SignIn = z.infer<typeof signInSchema>;

/** The signed-in user as every client sees it. Never carries a password or its hash. */
export const sessionUserSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  team: z.object({ id: z.string(), name: z.string() }),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

/** Answer of GET /api/session and POST /api/session. */
export const sessionStateSchema = z.object({ user: sessionUserSchema.nullable() });
export type SessionState = z.infer<typeof sessionStateSchema>;

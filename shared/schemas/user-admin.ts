import * as z from 'zod';
import { roleSchema } from './session.js';

/** A new password: long enough to resist guessing, short enough to hash quickly. */
export const newPasswordSchema = z
  .string('Enter a password.')
  .min(12, 'Use at least 12 characters.')
  .max(200, 'The password can have at most 200 characters.');

/** Body of POST /api/admin/users. */
export const userCreateSchema = z.object({
  email: z.email('Enter a valid e-mail address.').max(254, 'An e-mail address has at most 254 characters.'),
  name: z.string('Enter a name.').trim().min(1, 'Enter a name.').max(120, 'The name can have at most 120 characters.'),
  password: newPasswordSchema,
  role: roleSchema,
  teamId: z.uuid('Choose a team.'),
});
export type UserCreate = z.infer<typeof userCreateSchema>;

/** Body of PATCH /api/admin/users/:id: any subset of these fields. */
export const userUpdateSchema = z
  .object({
    name: z.string('Enter a name.').trim().min(1, 'Enter a name.').max(120, 'The name can have at most 120 characters.'),
    role: roleSchema,
    teamId: z.uuid('Choose a team.'),
    password: newPasswordSchema,
  })
  .partial()
  .refine((body) => Object.keys(body).length > 0, 'Change at least one of name, role, teamId or password.');
export type UserUpdate = z.infer<typeof userUpdateSchema>;

/** A user as admins see it (never a password or hash). */
export const adminUserSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  team: z.object({ id: z.string(), name: z.string() }),
  createdAt: z.string(),
});
export type AdminUser = z.infer<typeof adminUserSchema>;

/** Answer of GET /api/admin/users. */
export const adminUserListSchema = z.object({ users: z.array(adminUserSchema) });
export type AdminUserList = z.infer<typeof adminUserListSchema>;

import type { EntityManager } from '@mikro-orm/postgresql';
import { User } from '../entities/user.js';
import { verifyAgainstDecoy, verifyPassword } from './password-hash.js';
import { toAuthUser, type AuthUser } from './session-user.js';

/** The user with this e-mail and password, or null. Unknown e-mails take as long as wrong passwords. */
export async function checkCredentials(em: EntityManager, email: string, password: string): Promise<AuthUser | null> {
  const user = await em.findOne(User, { email: email.trim().toLowerCase() }, { populate: ['team'] });
  if (!user) return verifyAgainstDecoy(password).then(() => null);
  return (await verifyPassword(password, user.passwordHash)) ? toAuthUser(user, user.team) : null;
}

/** Loads the signed-in user afresh (role and team changes apply at once); null when the user was deleted. */
export async function loadAuthUser(em: EntityManager, id: string): Promise<AuthUser | null> {
  const user = await em.findOne(User, { id }, { populate: ['team'] });
  return user ? toAuthUser(user, user.team) : null;
}

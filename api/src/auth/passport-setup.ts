import type { MikroORM } from '@mikro-orm/postgresql';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { checkCredentials, loadAuthUser } from './credentials-check.js';
import type { AuthUser } from './session-user.js';

/**
 * A Passport instance of this app's own (not the module-wide one, so several apps in one process, as in
 * tests, never share strategies). The session holds only the user id; the user is reloaded per request.
 */
export type PassportInstance = InstanceType<typeof Passport>;

export function createPassport(orm: MikroORM): PassportInstance {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      checkCredentials(orm.em, email, password).then((user) => done(null, user ?? false), done);
    }),
  );
  passport.serializeUser<string>((user, done) => done(null, (user as AuthUser).id));
  passport.deserializeUser<string>((id, done) => {
    loadAuthUser(orm.em, id).then((user) => done(null, user ?? false), done);
  });
  return passport;
}

import { promisify } from 'node:util';
import type { MikroORM } from '@mikro-orm/postgresql';
import { Router, type Request, type Response } from 'express';
import { signInSchema, type SessionState } from '../../../shared/schemas/session.js';
import { issueCsrfToken, provideCsrfToken } from '../auth/csrf-token.js';
import type { PassportInstance } from '../auth/passport-setup.js';
import { toSessionUser, type AuthUser } from '../auth/session-user.js';
import { signInLimiters, type SignInLimits } from '../auth/sign-in-limiter.js';
import { HttpError } from '../http/http-error.js';
import { parseBody } from '../http/parse-body.js';
import { recordAudit } from '../services/audit-trail.js';

function authenticateLocal(passport: PassportInstance, req: Request, res: Response): Promise<AuthUser | false> {
  return new Promise((resolve, reject) => {
    const authenticate = passport.authenticate('local', { session: false }, (err: unknown, user: AuthUser | false) =>
      err ? reject(err) : resolve(user),
    );
    authenticate(req, res, reject);
  });
}

/** /api/session: who is signed in, sign-in and sign-out. */
export function sessionRouter(orm: MikroORM, passport: PassportInstance, limits: SignInLimits, onSignOut: (userId: string) => void = () => undefined): Router {
  const router = Router();

  router.get('/', (req, res) => {
    provideCsrfToken(req, res);
    const body: SessionState = { user: req.user ? toSessionUser(req.user) : null };
    res.json(body);
  });

  router.post('/', ...signInLimiters(limits), async (req, res) => {
    const { email } = parseBody(signInSchema, req);
    const user = await authenticateLocal(passport, req, res);
    if (!user) {
      recordAudit(orm.em, req, { action: 'session.sign_in_failed', actorEmail: email.toLowerCase() });
      await orm.em.flush();
      throw new HttpError(401, 'bad_credentials', 'That e-mail and password do not match an account.');
    }
    // passport 0.7 regenerates the session here, so a session id planted before sign-in is worthless.
    await promisify(req.login.bind(req))(user);
    issueCsrfToken(req, res);
    recordAudit(orm.em, req, { action: 'session.signed_in', teamId: user.teamId, targetType: 'user', targetId: user.id });
    await orm.em.flush();
    const body: SessionState = { user: toSessionUser(user) };
    res.json(body);
  });

  router.delete('/', async (req, res) => {
    if (req.user) {
      recordAudit(orm.em, req, { action: 'session.signed_out', teamId: req.user.teamId, targetType: 'user', targetId: req.user.id });
      await orm.em.flush();
    }
    const userId = req.user?.id;
    await promisify(req.logout.bind(req))();
    // An open live socket outlives the session it was opened with: close it with the session.
    if (userId) onSignOut(userId);
    issueCsrfToken(req, res);
    res.status(204).end();
  });

  return router;
}

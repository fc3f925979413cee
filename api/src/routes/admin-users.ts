import { randomUUID } from 'node:crypto';
import type { MikroORM } from '@mikro-orm/postgresql';
import { Router, type Request } from 'express';
import { userCreateSchema, userUpdateSchema, type AdminUserList } from '../../../shared/schemas/user-admin.js';
import { hashPassword } from '../auth/password-hash.js';
import { Team } from '../entities/team.js';
import { User } from '../entities/user.js';
import { HttpError, notFound } from '../http/http-error.js';
import { parseBody } from '../http/parse-body.js';
import { parseId } from '../http/parse-id.js';
import { withUniqueConflict } from '../http/unique-conflict.js';
import { toAdminUser } from '../services/admin-views.js';
import { recordAudit } from '../services/audit-trail.js';

const duplicateEmail = 'An account with that e-mail exists.';

/** /api/admin/users: admins list users, create them, change name, role, team or password, and delete them. */
export function adminUsersRouter(orm: MikroORM, onAccountChanged: (userId: string) => void = () => undefined): Router {
  const router = Router();

  async function loadTeam(id: string): Promise<Team> {
    const team = await orm.em.findOne(Team, { id });
    if (!team) throw new HttpError(400, 'invalid_body', 'That team does not exist.', { teamId: 'That team does not exist.' });
    return team;
  }

  async function loadUser(req: Request): Promise<User> {
    const user = await orm.em.findOne(User, { id: parseId(req.params.id, 'That user') }, { populate: ['team'] });
    if (!user) throw notFound('That user');
    return user;
  }

  function refuseSelf(req: Request, user: User, what: string): void {
    // Guards against an admin locking everyone out by demoting or deleting the last admin account: themselves.
    if (user.id === req.user!.id) throw new HttpError(409, 'conflict', `You cannot ${what} your own account; ask another admin.`);
  }

  router.get('/', async (req, res) => {
    const teamId = typeof req.query.teamId === 'string' ? parseId(req.query.teamId, 'That team') : undefined;
    const users = await orm.em.find(User, teamId ? { team: teamId } : {}, { populate: ['team'], orderBy: { email: 'asc' } });
    const body: AdminUserList = { users: users.map(toAdminUser) };
    res.json(body);
  });

  router.post('/', async (req, res) => {
    const input = parseBody(userCreateSchema, req);
    const team = await loadTeam(input.teamId);
    const user = orm.em.create(User, {
      id: randomUUID(),
      email: input.email.toLowerCase(),
      name: input.name,
      role: input.role,
      team,
      passwordHash: await hashPassword(input.password),
    });
    recordAudit(orm.em, req, { action: 'user.created', teamId: team.id, targetType: 'user', targetId: user.id, details: { email: user.email, role: user.role } });
    await withUniqueConflict(() => orm.em.flush(), 'email', duplicateEmail);
    res.status(201).json(toAdminUser(user));
  });

  router.patch('/:id', async (req, res) => {
    const user = await loadUser(req);
    const input = parseBody(userUpdateSchema, req);
    if (input.role !== undefined && input.role !== user.role) refuseSelf(req, user, 'change the role of');
    if (input.teamId !== undefined && input.teamId !== user.team.id) user.team = await loadTeam(input.teamId);
    if (input.name !== undefined) user.name = input.name;
    if (input.role !== undefined) user.role = input.role;
    if (input.password !== undefined) user.passwordHash = await hashPassword(input.password);
    const changed = Object.keys(input).filter((key) => key !== 'password');
    recordAudit(orm.em, req, {
      action: 'user.updated',
      teamId: user.team.id,
      targetType: 'user',
      targetId: user.id,
      details: { email: user.email, changed: input.password === undefined ? changed : [...changed, 'password'], role: user.role },
    });
    await orm.em.flush();
    if (input.role !== undefined || input.teamId !== undefined || input.password !== undefined) onAccountChanged(user.id);
    res.json(toAdminUser(user));
  });

  router.delete('/:id', async (req, res) => {
    const user = await loadUser(req);
    refuseSelf(req, user, 'delete');
    recordAudit(orm.em, req, { action: 'user.deleted', teamId: user.team.id, targetType: 'user', targetId: user.id, details: { email: user.email } });
    orm.em.remove(user);
    await orm.em.flush();
    onAccountChanged(user.id);
    res.status(204).end();
  });

  return router;
}

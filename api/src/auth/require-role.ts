import type { RequestHandler } from 'express';
import type { Role } from '../../../shared/schemas/session.js';
import { forbidden, unauthenticated } from '../http/http-error.js';

/** Lets the request through only for a signed-in user. */
export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) throw unauthenticated();
  next();
};

/** Lets the request through only for a signed-in user with one of the given roles. */
export function requireRole(...allowed: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw unauthenticated();
    if (!allowed.includes(req.user.role)) throw forbidden();
    next();
  };
}

/** Roles that may create and change work in their team. */
export const editorRoles: Role[] = ['admin', 'analyst'];

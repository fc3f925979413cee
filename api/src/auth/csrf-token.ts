import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { HttpError } from '../http/http-error.js';

export const csrfCookieName = 'XSRF-TOKEN';
export const csrfHeaderName = 'x-xsrf-token';
const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

function sendTokenCookie(req: Request, res: Response, token: string): void {
  // Readable by the page's script (Angular copies it into X-XSRF-TOKEN); useless to other sites, which can
  // neither read it nor make the browser send a matching header.
  res.cookie(csrfCookieName, token, { httpOnly: false, sameSite: 'strict', secure: req.secure, path: '/' });
}

/** Creates a fresh token bound to the session and hands it to the client (at sign-in, sign-out and first visit). */
export function issueCsrfToken(req: Request, res: Response): void {
  const token = randomBytes(32).toString('base64url');
  req.session.csrf = token;
  sendTokenCookie(req, res, token);
}

/** Hands the session's token to the client, creating one when the session has none yet. */
export function provideCsrfToken(req: Request, res: Response): void {
  if (req.session.csrf) sendTokenCookie(req, res, req.session.csrf);
  else issueCsrfToken(req, res);
}

function sameToken(expected: string | undefined, given: string | undefined): boolean {
  if (!expected || !given) return false;
  const a = Buffer.from(expected);
  const b = Buffer.from(given);
  return a.length === b.length && timingSafeEqual(a, b);
}

function crossOrigin(req: Request): boolean {
  const origin = req.get('origin');
  if (!origin) return false;
  try {
    return new URL(origin).host !== req.host;
  } catch {
    return true;
  }
}

/**
 * Refuses every state-changing request, sign-in included, unless it comes from our own origin and carries
 * the session's token in X-XSRF-TOKEN (the client gets it from GET /api/session).
 */
export const requireCsrfToken: RequestHandler = (req, _res, next) => {
  if (safeMethods.has(req.method)) {
    next();
    return;
  }
  if (crossOrigin(req)) throw new HttpError(403, 'csrf', 'Requests from other sites are refused.');
  if (!sameToken(req.session?.csrf, req.get(csrfHeaderName))) {
    throw new HttpError(403, 'csrf', 'The anti-forgery token is missing or stale. Reload the page and try again.');
  }
  next();
};

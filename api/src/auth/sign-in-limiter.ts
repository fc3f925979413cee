import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { sendError } from '../http/send-error.js';

export interface SignInLimits {
  /** Failed attempts allowed per client address and e-mail within windowMs. */
  limit: number;
  windowMs: number;
}

function emailOf(body: unknown): string {
  const email = (body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase().slice(0, 254) : '';
}

/**
 * Throttles sign-in guessing. Only failures count (successful sign-ins are taken back), so people who sign in
 * often are never slowed. Two limits: per client address and e-mail (the tight one), and per client address
 * alone, twenty times as wide, against trying many e-mails. Counts live in this process's memory.
 */
export function signInLimiters(limits: SignInLimits): RequestHandler[] {
  const tooMany: RequestHandler = (_req, res) =>
    sendError(res, 429, 'too_many_requests', 'Too many failed sign-ins. Wait a minute, then try again.');
  const common = {
    windowMs: limits.windowMs,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: tooMany,
  };
  return [
    rateLimit({ ...common, limit: limits.limit * 20, keyGenerator: (req) => ipKeyGenerator(req.ip ?? '') }),
    rateLimit({ ...common, limit: limits.limit, keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${emailOf(req.body)}` }),
  ];
}

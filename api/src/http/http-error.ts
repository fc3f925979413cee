import type { ErrorCode } from '../../../shared/schemas/api-error.js';

/** An error with an HTTP status and an API error code; the error handler turns it into the JSON error shape. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const notFound = (what = 'That resource') => new HttpError(404, 'not_found', `${what} does not exist or is not yours to see.`);
export const forbidden = (message = 'Your role does not allow this.') => new HttpError(403, 'forbidden', message);
export const unauthenticated = () => new HttpError(401, 'unauthenticated', 'Sign in first.');

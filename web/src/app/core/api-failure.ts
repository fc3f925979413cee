import { HttpErrorResponse, HttpHeaders } from '@angular/common/http';
import { apiErrorSchema } from '../../../../shared/schemas/api-error';

/**
 * A failed API call in the one shape the pages handle: the server's stable code and its sentence for people,
 * or our own sentence when the server could not be reached or answered outside the agreed error shape.
 */
export class ApiFailure extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Readonly<Record<string, string>> = {},
    readonly retryAfterSeconds: number | null = null,
  ) {
    super(message);
    this.name = 'ApiFailure';
  }
}

/** Turns whatever an HTTP call threw into an ApiFailure. */
export function toApiFailure(err: unknown): ApiFailure {
  if (err instanceof ApiFailure) return err;
  if (!(err instanceof HttpErrorResponse)) {
    return new ApiFailure(0, 'client', 'Something went wrong on this page. Reload it and try again.');
  }
  if (err.status === 0) {
    return new ApiFailure(0, 'unreachable', 'The Conserva server could not be reached. Check your connection and try again.');
  }
  const body = apiErrorSchema.safeParse(err.error);
  if (!body.success) {
    return new ApiFailure(err.status, 'unexpected', `The server answered with an unexpected error (HTTP ${err.status}). Try again in a moment.`);
  }
  const { code, message, fields } = body.data.error;
  return new ApiFailure(err.status, code, message, fields, retryAfterSeconds(err.headers));
}

function retryAfterSeconds(headers: HttpHeaders): number | null {
  const value = Number(headers.get('Retry-After'));
  return Number.isFinite(value) && value > 0 ? value : null;
}

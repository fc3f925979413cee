import type { Request } from 'express';
import type { z } from 'zod';
import { safeParsePlain } from '../../../shared/schemas/plain-issue-message.js';
import { HttpError } from './http-error.js';

/** Validates a request body against a shared schema; on failure answers 400 with a message per field. */
export function parseBody<S extends z.ZodType>(schema: S, req: Request): z.output<S> {
  return parseInput(schema, req.body ?? {});
}

/** Validates any client input (a parsed form field, a query) like a body: 400 with a plain sentence per field. */
export function parseInput<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const result = safeParsePlain(schema, input);
  if (result.success) return result.data;
  const fields: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '(body)';
    fields[key] ??= issue.message;
  }
  const summary = Object.entries(fields).map(([key, message]) => `${key}: ${message}`).join('; ');
  throw new HttpError(400, 'invalid_body', `The request body is not valid. ${summary}`, fields);
}
